// @ts-check
// Sign-in: name and password; on success back to the page that sent the visitor here.
import { el, fill, $, param } from '../core/dom.js';
import { sendJson, resetAntiforgery } from '../core/api.js';
import { frame } from '../core/shell.js';

frame('signin.html');
$('#signin').addEventListener('submit', async (event) => {
  event.preventDefault();
  const button = $('#signin-button');
  button.disabled = true;
  try {
    await sendJson('POST', '/api/auth/sign-in', { name: $('#name').value, password: $('#password').value });
    resetAntiforgery();
    const next = param('next') ?? 'index.html';
    // Only a page of this site: a path without a scheme or a leading double slash.
    location.href = /^[a-z0-9._-]+\.html(\?.*)?$/i.test(next) ? next : 'index.html';
  } catch (e) {
    fill($('#signin-result'), el('div', { class: 'problem' }, e.message));
    $('#password').select();
  } finally {
    button.disabled = false;
  }
});
