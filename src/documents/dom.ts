import { isTag, isText, type ChildNode, type Element } from 'domhandler';
import { appendAll } from '../arrays.js';

/** Small helpers over the htmlparser2 DOM shared by the HTML and JATS readers. */

export function tagName(node: ChildNode): string | null {
  return isTag(node) ? node.name.toLowerCase() : null;
}

export function elementChildren(element: Element): Element[] {
  return element.children.filter(isTag);
}

export function childByName(element: Element, name: string): Element | undefined {
  return elementChildren(element).find((child) => child.name.toLowerCase() === name);
}

export function childrenByName(element: Element, name: string): Element[] {
  return elementChildren(element).filter((child) => child.name.toLowerCase() === name);
}

/** Every descendant element with this name, in document order, not entering elements with that same name. */
export function descendantsByName(element: Element, name: string): Element[] {
  const found: Element[] = [];
  for (const child of elementChildren(element)) {
    if (child.name.toLowerCase() === name) found.push(child);
    else appendAll(found, descendantsByName(child, name));
  }
  return found;
}

export function attribute(element: Element, name: string): string {
  return element.attribs[name] ?? '';
}

/** Whether a whitespace-only text node (layout between tags, not content). */
export function isBlankText(node: ChildNode): boolean {
  return isText(node) && node.data.trim().length === 0;
}

/** The nearest element siblings before and after a node (blank text skipped). */
export function previousElement(node: ChildNode): Element | null {
  for (let sibling = node.prev; sibling; sibling = sibling.prev) {
    if (isTag(sibling)) return sibling;
    if (!isBlankText(sibling)) return null;
  }
  return null;
}

export function nextElement(node: ChildNode): Element | null {
  for (let sibling = node.next; sibling; sibling = sibling.next) {
    if (isTag(sibling)) return sibling;
    if (!isBlankText(sibling)) return null;
  }
  return null;
}
