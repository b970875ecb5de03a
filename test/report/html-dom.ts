// Reading the HTML report back with parse5, a general-purpose HTML parser (WHATWG HTML parsing), for the report tests.
import { parse, type DefaultTreeAdapterMap } from 'parse5';

/** A parsed element or text node. */
export type HtmlNode = DefaultTreeAdapterMap['node'];
export type HtmlElement = DefaultTreeAdapterMap['element'];

/**
 * The parsed document and every parse error parse5 raised (parse5 recovers from errors, so they are
 * collected). By default the page is parsed as a browser with scripting off does, so the diagrams
 * inside <noscript> are elements; with `scripting` they are text, as for a browser running the script.
 */
export function parseReport(html: string, options: { scripting?: boolean } = {}): { document: DefaultTreeAdapterMap['document']; errors: { code: string; line: number; column: number }[] } {
  const errors: { code: string; line: number; column: number }[] = [];
  const document = parse(html, {
    scriptingEnabled: options.scripting ?? false,
    onParseError: (error) => void errors.push({ code: error.code, line: error.startLine, column: error.startCol }),
  });
  return { document, errors };
}

/** Every element under a node, in document order (template contents included). */
export function elements(root: HtmlNode): HtmlElement[] {
  const found: HtmlElement[] = [];
  const stack: HtmlNode[] = [root];
  while (stack.length > 0) {
    const node = stack.pop()!;
    if ('tagName' in node) found.push(node);
    const children: HtmlNode[] = 'childNodes' in node ? [...node.childNodes] : [];
    if ('content' in node && node.content) children.push(node.content as HtmlNode);
    for (let index = children.length - 1; index >= 0; index--) stack.push(children[index]);
  }
  return found;
}

/** An attribute's value, or undefined. */
export function attribute(element: HtmlElement, name: string): string | undefined {
  return element.attrs.find((attr) => attr.name === name)?.value;
}

/** Whether the element's class list holds the class. */
export function hasClass(element: HtmlElement, name: string): boolean {
  return (attribute(element, 'class') ?? '').split(/\s+/).includes(name);
}

/** Elements under root with the tag name and (optionally) the class. */
export function select(root: HtmlNode, tagName: string, className?: string): HtmlElement[] {
  return elements(root).filter((element) => element.tagName === tagName && (className === undefined || hasClass(element, className)));
}

/** The element with the id. */
export function byId(root: HtmlNode, id: string): HtmlElement | undefined {
  return elements(root).find((element) => attribute(element, 'id') === id);
}

/** The text of a node and its descendants, as the DOM's textContent gives it. */
export function textOf(node: HtmlNode): string {
  if (node.nodeName === '#text') return (node as DefaultTreeAdapterMap['textNode']).value;
  return 'childNodes' in node ? node.childNodes.map(textOf).join('') : '';
}
