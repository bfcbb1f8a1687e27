// @ts-check
// People and keys (administrators): add people (with an e-mail address for alerts), change roles and addresses,
// disable, set passwords; create and revoke keys.
import { el, fill, $ } from '../core/dom.js';
import { getJson, sendJson } from '../core/api.js';
import { frame } from '../core/shell.js';
import { when } from '../core/format.js';

frame('people.html');
const roles = ['technician', 'supervisor', 'engineer', 'administrator'];
fill($('#p-role'), roles.map((r) => el('option', { value: r }, r)));

function report(target, error, text) {
  fill($(target), error ? el('div', { class: 'problem' }, error.message) : el('div', { class: 'notice' }, text));
}

async function loadPeople() {
  const people = await getJson('/api/people');
  fill($('#people tbody'), people.map((p) => {
    const role = el('select', { 'aria-label': `role of ${p.name}` }, roles.map((r) => el('option', { value: r, selected: r === p.role }, r)));
    role.addEventListener('change', () => change(p.name, { role: role.value }, `${p.name} is now ${role.value}.`));
    const email = el('input', { type: 'email', value: p.email ?? '', placeholder: 'none', 'aria-label': `e-mail address of ${p.name}`, class: 'email' });
    email.addEventListener('change', () => change(p.name, { email: email.value },
      email.value ? `Alerts for ${p.name} by e-mail go to ${email.value}.` : `${p.name} has no e-mail address now.`));
    const password = el('input', { type: 'password', placeholder: 'new password', 'aria-label': `new password for ${p.name}`, autocomplete: 'new-password' });
    return el('tr', { dataset: { person: p.name } },
      el('td', {}, p.name), el('td', {}, role), el('td', {}, email), el('td', {}, when(p.created_at)),
      el('td', {}, p.disabled_at ? `disabled ${when(p.disabled_at)}` : p.locked_until ? `locked until ${when(p.locked_until)}` : 'active'),
      el('td', {},
        el('button', { type: 'button', class: 'quiet', onclick: () => change(p.name, { disabled: !p.disabled_at }, `${p.name} ${p.disabled_at ? 'enabled' : 'disabled'}.`) },
          p.disabled_at ? 'enable' : 'disable'), ' ', password, ' ',
        el('button', { type: 'button', class: 'quiet', onclick: () => setPassword(p.name, password.value) }, 'set password')));
  }));
}

async function change(name, body, done) {
  try {
    await sendJson('PUT', `/api/people/${encodeURIComponent(name)}`, body);
    report('#people-result', null, done);
  } catch (e) {
    report('#people-result', e);
  }
  await loadPeople();
}

async function setPassword(name, password) {
  try {
    await sendJson('POST', `/api/people/${encodeURIComponent(name)}/password`, { password });
    report('#people-result', null, `New password set for ${name}; the account is unlocked.`);
  } catch (e) {
    report('#people-result', e);
  }
}

$('#add-person').addEventListener('submit', async (event) => {
  event.preventDefault();
  try {
    const p = await sendJson('POST', '/api/people', { name: $('#p-name').value, role: $('#p-role').value, password: $('#p-password').value, email: $('#p-email').value || null });
    report('#people-result', null, `${p.name} added as ${p.role}.`);
    $('#add-person').reset();
  } catch (e) {
    report('#people-result', e);
  }
  await loadPeople();
});

async function loadKeys() {
  const keys = await getJson('/api/keys');
  fill($('#keys tbody'), keys.map((k) => el('tr', { dataset: { key: k.id } },
    el('td', {}, k.name), el('td', {}, k.scope), el('td', {}, `${when(k.created_at)} by ${k.created_by}`),
    el('td', {}, k.last_used_at ? when(k.last_used_at) : 'never'),
    el('td', {}, k.revoked_at ? `revoked ${when(k.revoked_at)} by ${k.revoked_by}` : 'live'),
    el('td', {}, k.revoked_at ? '' : el('button', {
      type: 'button', class: 'quiet',
      onclick: async () => {
        await sendJson('POST', `/api/keys/${k.id}/revoke`);
        await loadKeys();
      },
    }, 'revoke')))));
}

$('#add-key').addEventListener('submit', async (event) => {
  event.preventDefault();
  try {
    const created = await sendJson('POST', '/api/keys', { name: $('#k-name').value, scope: $('#k-scope').value });
    const link = created.details.scope === 'display' ? `${location.origin}/display/${created.key}` : created.key;
    fill($('#key-result'), el('div', { class: 'notice' },
      el('p', {}, `Copy it now: it is shown only this once. ${created.use}.`), el('div', { class: 'key-once', id: 'new-key' }, link)));
    $('#add-key').reset();
  } catch (e) {
    report('#key-result', e);
  }
  await loadKeys();
});

await Promise.all([loadPeople(), loadKeys()]);
