import { DOMParser as XmlDomParser } from '@xmldom/xmldom';
import { InputError } from '../core/InputError';

/**
 * Parses XML text into a DOM Document: the browser's DOMParser where there is one, otherwise
 * @xmldom/xmldom (Node, CLI). Throws InputError naming `fileName` (and the line where the parser
 * says) when the text is not well-formed XML.
 */
export function xmlParse(fileName: string, text: string): Document {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const Native = (globalThis as { DOMParser?: typeof DOMParser }).DOMParser;
  if (Native) {
    const doc = new Native().parseFromString(body, 'text/xml');
    const error = doc.getElementsByTagName('parsererror')[0];
    if (error) throw new InputError(`${fileName}: not well-formed XML (${(error.textContent ?? '').trim().split('\n')[0]})`);
    return doc;
  }
  try {
    // onError keeps xmldom from printing to the console; fatal errors still throw.
    return new XmlDomParser({ onError: () => {} }).parseFromString(body, 'text/xml') as unknown as Document;
  } catch (error) {
    const message = error instanceof Error ? error.message.split('\n')[0] : String(error);
    const at = (error as { locator?: { lineNumber?: number; columnNumber?: number } }).locator;
    const where = at?.lineNumber ? ` at line ${at.lineNumber}, column ${at.columnNumber}` : '';
    throw new InputError(`${fileName}: not well-formed XML${where} (${message})`);
  }
}
