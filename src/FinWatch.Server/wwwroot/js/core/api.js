// JSON over HTTP with the server's problem details turned into readable messages.

export class ApiError extends Error {
  constructor(status, problem) {
    super(describeProblem(status, problem));
    this.status = status;
    this.problem = problem ?? {};
  }
}

/** "title: detail" plus one line per field error, as the server words them. */
export function describeProblem(status, problem) {
  if (!problem) return `The server answered ${status}.`;
  const lines = [problem.title ?? `The server answered ${status}.`];
  if (problem.detail) lines.push(problem.detail);
  for (const [field, messages] of Object.entries(problem.errors ?? {})) {
    for (const m of [].concat(messages)) lines.push(`${field}: ${m}`);
  }
  return lines.join('\n');
}

async function parse(response) {
  const type = response.headers.get('content-type') ?? '';
  const body = type.includes('json') ? await response.json() : null;
  if (!response.ok) throw new ApiError(response.status, body);
  return body;
}

export async function getJson(url) {
  return parse(await fetch(url, { headers: { accept: 'application/json' } }));
}

export async function sendJson(method, url, body) {
  return parse(await fetch(url, {
    method,
    headers: { 'content-type': 'application/json', accept: 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  }));
}

/** Sends a text body (CSV upload) and returns { status, body } without throwing, so callers can show row errors. */
export async function sendText(url, text, contentType = 'text/csv') {
  const response = await fetch(url, { method: 'POST', headers: { 'content-type': contentType, accept: 'application/json' }, body: text });
  const type = response.headers.get('content-type') ?? '';
  return { status: response.status, ok: response.ok, body: type.includes('json') ? await response.json() : null };
}
