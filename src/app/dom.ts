/** Builds an element with text children only: names from files are always text nodes, never markup. */
export function el<K extends keyof HTMLElementTagNameMap>(tag: K, className: string | null, ...children: (Node | string | null)[]): HTMLElementTagNameMap[K] {
  const node = document.createElement(tag);
  if (className) node.className = className;
  for (const c of children) if (c !== null) node.append(typeof c === 'string' ? document.createTextNode(c) : c);
  return node;
}
