// @ts-check
// Building DOM without innerHTML: every user-supplied string (lot ids, comments, plan text) lands as text, never markup.

/** el('td', { class: 'num', title: 't' }, 'text', childNode, ...) */
export function el(tag, attrs = {}, ...children) {
  const node = document.createElement(tag);
  for (const [key, value] of Object.entries(attrs ?? {})) {
    if (value === undefined || value === null || value === false) continue;
    if (key === 'class') node.className = value;
    else if (key === 'dataset') Object.assign(node.dataset, value);
    else if (key.startsWith('on') && typeof value === 'function') node.addEventListener(key.slice(2), value);
    else if (value === true) node.setAttribute(key, '');
    else node.setAttribute(key, String(value));
  }
  append(node, children);
  return node;
}

function append(node, children) {
  for (const child of children) {
    if (child === undefined || child === null || child === false) continue;
    if (Array.isArray(child)) append(node, child);
    else node.append(child instanceof Node ? child : document.createTextNode(String(child)));
  }
}

/** Replaces the children of a node. */
export function fill(node, ...children) {
  node.replaceChildren();
  append(node, children);
  return node;
}

export const $ = (selector, root = document) => root.querySelector(selector);

/** The query-string parameter, or a fallback. */
export function param(name, fallback = null) {
  return new URLSearchParams(location.search).get(name) ?? fallback;
}

const svgNs = 'http://www.w3.org/2000/svg';

/** An SVG element with attributes (null ones left out) and children (text or nodes): svg('polygon', { points: '0,0 4,8' }). */
export function svg(tag, attrs = {}, ...children) {
  const node = document.createElementNS(svgNs, tag);
  for (const [k, v] of Object.entries(attrs)) if (v !== undefined && v !== null) node.setAttribute(k, String(v));
  for (const c of children) if (c) node.append(c instanceof Node ? c : document.createTextNode(String(c)));
  return node;
}
