import { DOMParser as XmlDomParser } from '@xmldom/xmldom';
import { limitExceeded, MAX_XML_DEPTH } from '../../core/common/inputLimits';
import { InputError } from '../../core/common/InputError';

/**
 * Refuses a document nested deeper than {@link MAX_XML_DEPTH} elements, walking it without
 * recursion; the readers after it (togeojson, our own walks) recurse once per level.
 */
function depthChecked(fileName: string, doc: Document): Document {
  let node: Node | null = doc.documentElement;
  let depth = 1;
  while (node) {
    if (depth > MAX_XML_DEPTH && node.nodeType === 1) throw limitExceeded(fileName, `its elements are nested more than ${MAX_XML_DEPTH} levels deep`, `${MAX_XML_DEPTH} levels`);
    if (node.firstChild) {
      node = node.firstChild;
      depth++;
      continue;
    }
    while (node && !node.nextSibling) {
      node = node.parentNode;
      depth--;
      if (node === doc || depth <= 0) return doc;
    }
    node = node?.nextSibling ?? null;
  }
  return doc;
}

/**
 * Parses XML text into a DOM Document: the browser's DOMParser where there is one, otherwise
 * @xmldom/xmldom (Node, CLI). Throws InputError naming `fileName` (and the line where the parser
 * says) when the text is not well-formed XML or is nested deeper than MAX_XML_DEPTH elements.
 */
export function xmlParse(fileName: string, text: string): Document {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const Native = (globalThis as { DOMParser?: typeof DOMParser }).DOMParser;
  if (Native) {
    const doc = new Native().parseFromString(body, 'text/xml');
    const error = doc.getElementsByTagName('parsererror')[0];
    if (error) throw new InputError(`${fileName}: not well-formed XML (${(error.textContent ?? '').trim().split('\n')[0]})`);
    return depthChecked(fileName, doc);
  }
  let doc: Document;
  let first: string | null = null;
  try {
    // Recoverable errors (a bare "<" in text, say) are refused too, as the browser's parser refuses them,
    // so the command line and the planner read the same files; warnings are not printed.
    doc = new XmlDomParser({
      onError: (level: string, message: string) => {
        if (level === 'warning') return;
        first ??= message;
        throw new Error(message);
      },
    }).parseFromString(body, 'text/xml') as unknown as Document;
  } catch (error) {
    const message = (first ?? (error instanceof Error ? error.message : String(error))).split('\n')[0].replace(/^\[xmldom \w+\]\s*/, '');
    const at = (error as { locator?: { lineNumber?: number; columnNumber?: number } }).locator;
    const where = at?.lineNumber ? ` at line ${at.lineNumber}, column ${at.columnNumber}` : '';
    throw new InputError(`${fileName}: not well-formed XML${where} (${message})`);
  }
  return depthChecked(fileName, doc);
}
