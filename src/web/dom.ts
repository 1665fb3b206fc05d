/**
 * Tiny DOM builder for the page's controls: `h('button', { type: 'button' }, 'Refit')`.
 * String children always become text nodes (never markup), so file text stays text.
 */
export type Child = Node | string | number | null | undefined | false | readonly Child[];

/** Attributes (string/number/boolean; false and null leave them out) and `on…` event listeners. */
export type Props = Record<string, string | number | boolean | null | undefined | EventListener>;

/** Create an element with attributes, `on…` listeners and children. */
export function h<K extends keyof HTMLElementTagNameMap>(tag: K, props: Props = {}, ...children: Child[]): HTMLElementTagNameMap[K] {
  const element = document.createElement(tag);
  for (const [key, value] of Object.entries(props)) {
    if (value === null || value === undefined || value === false) continue;
    if (key.startsWith('on') && typeof value === 'function') element.addEventListener(key.slice(2), value);
    else if (key === 'value' && 'value' in element) (element as HTMLInputElement).value = String(value);
    else if (key === 'checked' && element instanceof HTMLInputElement) element.checked = Boolean(value);
    else element.setAttribute(key, value === true ? '' : String(value));
  }
  append(element, children);
  return element;
}

function append(parent: Node, children: readonly Child[]): void {
  for (const child of children) {
    if (child === null || child === undefined || child === false) continue;
    if (Array.isArray(child)) append(parent, child);
    else if (child instanceof Node) parent.appendChild(child);
    else parent.appendChild(document.createTextNode(String(child)));
  }
}

/** Replace all children of `parent`. */
export function replaceChildren(parent: Element, ...children: Child[]): void {
  parent.replaceChildren();
  append(parent, children);
}

let counter = 0;

/** A page-unique id with a prefix, for label/aria wiring. */
export function uniqueId(prefix: string): string {
  counter += 1;
  return `${prefix}-${counter}`;
}
