/**
 * A small well-formedness check for the SVG and HTML the report writes:
 * tags nest and close, attribute values are quoted, '&' only starts a known
 * entity or a character reference, and no raw '<' appears in text. HTML void
 * elements may be listed so that the page itself can be checked.
 */
const ENTITY = /^&(amp|lt|gt|quot|apos|#[0-9]+|#x[0-9a-fA-F]+);/;

export function checkXml(text: string, voidElements: string[] = []): { elements: number; rootTags: string[] } {
  const stack: string[] = [];
  const rootTags: string[] = [];
  let i = 0;
  let elements = 0;
  const fail = (why: string): never => { throw new Error(`not well-formed at ${i}: ${why}: ${JSON.stringify(text.slice(Math.max(0, i - 40), i + 40))}`); };
  while (i < text.length) {
    const ch = text[i];
    if (ch === '<') {
      if (text.startsWith('<?', i)) { const e = text.indexOf('?>', i); if (e < 0) fail('unclosed <?'); i = e + 2; continue; }
      if (text.startsWith('<!--', i)) { const e = text.indexOf('-->', i); if (e < 0) fail('unclosed comment'); i = e + 3; continue; }
      if (text.startsWith('<!DOCTYPE', i)) { const e = text.indexOf('>', i); i = e + 1; continue; }
      const close = text[i + 1] === '/';
      const m = /^<\/?([A-Za-z][A-Za-z0-9:_-]*)/.exec(text.slice(i, i + 64));
      if (!m) fail('bad tag name');
      const name = m![1];
      let j = i + m![0].length;
      // attributes
      for (;;) {
        while (/\s/.test(text[j])) j++;
        if (text[j] === '>' || text.startsWith('/>', j)) break;
        if (close) fail('attributes on a closing tag');
        const a = /^([A-Za-z_:][A-Za-z0-9_:.-]*)="([^"<]*)"/.exec(text.slice(j));
        if (!a) { i = j; fail('attribute not of the form name="value"'); }
        const v = a![2];
        for (let k = v.indexOf('&'); k >= 0; k = v.indexOf('&', k + 1)) if (!ENTITY.test(v.slice(k))) { i = j; fail('bad entity in attribute'); }
        j += a![0].length;
      }
      const selfClosing = text.startsWith('/>', j);
      const end = selfClosing ? j + 2 : j + 1;
      if (close) {
        const top = stack.pop();
        if (top !== name) fail(`</${name}> closes <${top ?? 'nothing'}>`);
      } else {
        elements++;
        if (stack.length === 0) rootTags.push(name);
        if (!selfClosing && !voidElements.includes(name.toLowerCase())) {
          stack.push(name);
          if (name === 'style' || name === 'script') {
            const e = text.indexOf(`</${name}>`, end);
            if (e < 0) fail(`unclosed <${name}>`);
            i = e;
            continue;
          }
        }
      }
      i = end;
      continue;
    }
    if (ch === '&' && !ENTITY.test(text.slice(i, i + 12))) fail('bare &');
    if (ch === '>' && stack.length === 0 && text.slice(0, i).trim() === '') fail('stray >');
    i++;
  }
  if (stack.length) throw new Error(`not well-formed: unclosed <${stack.join('> <')}>`);
  return { elements, rootTags };
}
