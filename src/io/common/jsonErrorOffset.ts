/**
 * Offset of the first JSON syntax error in `text` (RFC 8259 grammar), or -1 when the text is
 * valid JSON. Used only after JSON.parse has failed, to say where: V8 does not always give a
 * position. Recursive descent: nesting deeper than the stack allows throws a RangeError.
 */
export function jsonErrorOffset(text: string): number {
  let i = 0;
  const ws = () => {
    while (i < text.length && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++;
  };
  const literal = (word: string) => {
    if (text.startsWith(word, i)) {
      i += word.length;
      return true;
    }
    for (let k = 0; k < word.length && text[i] === word[k]; k++) i++;
    return false;
  };
  const string = (): boolean => {
    i++;
    while (i < text.length) {
      const c = text.charCodeAt(i);
      if (c === 0x22) {
        i++;
        return true;
      }
      if (c < 0x20) return false;
      if (c === 0x5c) {
        const e = text[i + 1];
        if (e === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6))) {
            i += 2;
            return false;
          }
          i += 6;
        } else if (e !== undefined && '"\\/bfnrt'.includes(e)) i += 2;
        else {
          i++;
          return false;
        }
      } else i++;
    }
    return false;
  };
  const number = (): boolean => {
    const m = /^-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/.exec(text.slice(i, i + 400));
    if (!m || m[0] === '-' || m[0] === '') return false;
    i += m[0].length;
    return true;
  };
  const value = (): boolean => {
    ws();
    const c = text[i];
    if (c === '{') {
      i++;
      ws();
      if (text[i] === '}') return ++i > 0;
      for (;;) {
        ws();
        if (text[i] !== '"' || !string()) return false;
        ws();
        if (text[i] !== ':') return false;
        i++;
        if (!value()) return false;
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === '}') return ++i > 0;
        else return false;
      }
    }
    if (c === '[') {
      i++;
      ws();
      if (text[i] === ']') return ++i > 0;
      for (;;) {
        if (!value()) return false;
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === ']') return ++i > 0;
        else return false;
      }
    }
    if (c === '"') return string();
    if (c === 't') return literal('true');
    if (c === 'f') return literal('false');
    if (c === 'n') return literal('null');
    if (c === '-' || (c >= '0' && c <= '9')) return number();
    return false;
  };
  if (!value()) return i;
  ws();
  return i < text.length ? i : -1;
}
