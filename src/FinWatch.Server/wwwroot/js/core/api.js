// @ts-check
// JSON over HTTP with the server's problem details turned into readable messages. Writes carry the antiforgery token
// (header X-FinWatch-Antiforgery) that the server asks of browser sessions; a stale token is fetched again once.

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
    for (const m of [].concat(messages)) lines.push(`${field}: ${typeof m === 'string' ? m : JSON.stringify(m)}`);
  }
  return lines.join('\n');
}

let token = null;

async function antiforgery(refresh = false) {
  if (refresh || !token) {
    const r = await fetch('/api/auth/antiforgery', { headers: { accept: 'application/json' } });
    token = (await r.json()).token;
  }
  return token;
}

/** Forget the token (after signing in or out the server binds a new one to the new identity). */
export function resetAntiforgery() { token = null; }

/** A write with the antiforgery header; retried once with a fresh token when the server says the token is stale. */
async function write(url, init) {
  for (let attempt = 0; ; attempt++) {
    const headers = { ...init.headers, 'X-FinWatch-Antiforgery': await antiforgery(attempt > 0) };
    const response = await fetch(url, { ...init, headers });
    if (response.status !== 400 || attempt > 0) return response;
    const problem = await response.clone().json().catch(() => null);
    if (problem?.type !== '/problems/antiforgery') return response;
  }
}

// Not signed in (or the session ended): go to the sign-in page and come back here afterwards. Returns whether the
// page is leaving, in which case the caller's request never settles (the page has nothing left to do with it).
function signInFirst(response) {
  if (response.status === 401 && !location.pathname.endsWith('signin.html')) {
    location.href = `signin.html?next=${encodeURIComponent(location.pathname.slice(1) + location.search)}`;
    return true;
  }
  return false;
}

const leaving = () => new Promise(() => {});

async function parse(response) {
  const type = response.headers.get('content-type') ?? '';
  const body = type.includes('json') ? await response.json() : null;
  if (!response.ok) {
    if (signInFirst(response)) return leaving();
    throw new ApiError(response.status, body);
  }
  return body;
}

export async function getJson(url) {
  return parse(await fetch(url, { headers: { accept: 'application/json' } }));
}

export async function sendJson(method, url, body) {
  return parse(await write(url, {
    method,
    headers: { 'content-type': 'application/json', accept: 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  }));
}

/** Sends a text body (CSV upload) and returns { status, body } without throwing, so callers can show row errors. */
export async function sendText(url, text, contentType = 'text/csv') {
  const response = await write(url, { method: 'POST', headers: { 'content-type': contentType, accept: 'application/json' }, body: text });
  if (signInFirst(response)) return leaving();
  const type = response.headers.get('content-type') ?? '';
  return { status: response.status, ok: response.ok, body: type.includes('json') ? await response.json() : null };
}

/** The server's problems keyed by field ({} when the error has none), each as one line of text. */
export function fieldProblems(error) {
  /** @type {Record<string, string>} */
  const out = {};
  for (const [field, messages] of Object.entries(error?.problem?.errors ?? {})) out[field] = [].concat(messages).join(' ');
  return out;
}
