/**
 * Limits on the shape of a parsed request or spec document, and how messages
 * quote parts of it, so that no document, however hostile, makes validation
 * or error building slow, deep or multi-line:
 *
 *  - nesting deeper than MAX_DOCUMENT_DEPTH is refused at once (an iterative
 *    walk, so a document nested 10^5 deep cannot overflow the stack);
 *  - values are quoted by `excerpt`: at most 60 characters, built without
 *    serialising the whole value (so quoting is bounded however large it is);
 *  - key names are quoted by `fieldKey`: plain names as they are, anything
 *    else as an escaped JSON string of at most 40 characters (no raw newlines
 *    or terminal escapes reach a terminal or a log);
 *  - at most MAX_LISTED_PROBLEMS problems are listed per document.
 */

/** Deepest nesting of objects and arrays any document needs (specs need 3, probe requests 2). */
export const MAX_DOCUMENT_DEPTH = 32;
/** Most problems listed for one document; the rest are counted. */
export const MAX_LISTED_PROBLEMS = 20;

/** The one-line problem of a document nested too deep, naming the top-level field it starts in, or null. */
export function nestingProblem(doc: unknown, root: string): string | null {
  if (typeof doc !== 'object' || doc === null) return null;
  // iterative depth-first walk; each entry is (value, depth, top-level field)
  const stack: Array<[unknown, number, string | null]> = [[doc, 1, null]];
  while (stack.length > 0) {
    const [v, depth, top] = stack.pop()!;
    if (depth > MAX_DOCUMENT_DEPTH) {
      return `${top === null ? root : fieldKey(top)}: nested more than ${MAX_DOCUMENT_DEPTH} levels deep; allowed: at most ${MAX_DOCUMENT_DEPTH} levels of tables and lists`;
    }
    if (Array.isArray(v)) {
      for (const x of v) if (typeof x === 'object' && x !== null) stack.push([x, depth + 1, top]);
    } else {
      for (const k in v as Record<string, unknown>) {
        if (!Object.prototype.hasOwnProperty.call(v, k)) continue;
        const x = (v as Record<string, unknown>)[k];
        if (typeof x === 'object' && x !== null) stack.push([x, depth + 1, top ?? k]);
      }
    }
  }
  return null;
}

const PLAIN_KEY = /^[A-Za-z0-9_][A-Za-z0-9_.-]{0,63}$/;

/** A key name as messages print it: plain names unchanged, others as an escaped, bounded JSON string. */
export function fieldKey(key: string): string {
  if (PLAIN_KEY.test(key)) return key;
  return escapedString(key, 40);
}

/** JSON string of at most `max` characters of s (escaped: control characters and non-ASCII as \uXXXX). */
function escapedString(s: string, max: number): string {
  const cut = s.length > max ? s.slice(0, max) : s;
  const body = JSON.stringify(cut).replace(/[\u007f-\uffff]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
  return s.length > max ? `${body.slice(0, -1)}..."` : body;
}

/**
 * A value as messages quote it: JSON-like, at most `max` characters ending in
 * "..." when cut. Built piece by piece and stopped at the budget, so a huge or
 * deeply nested value costs no more than a small one.
 */
export function excerpt(v: unknown, max = 60): string {
  if (v === undefined) return 'nothing';
  let out = '';
  const budget = max + 1;
  const put = (s: string) => {
    out += s;
    return out.length < budget;
  };
  const walk = (x: unknown, depth: number): boolean => {
    if (x === null) return put('null');
    switch (typeof x) {
      case 'number':
        return put(Number.isFinite(x) ? String(x) : String(x));
      case 'bigint':
        return put(x.toString());
      case 'boolean':
        return put(String(x));
      case 'string':
        return put(escapedString(x, budget));
      case 'object':
        break;
      default:
        return put(String(typeof x));
    }
    if (depth > 8) return put('...');
    if (Array.isArray(x)) {
      if (!put('[')) return false;
      for (let i = 0; i < x.length; i++) {
        if (i > 0 && !put(',')) return false;
        if (!walk(x[i], depth + 1)) return false;
      }
      return put(']');
    }
    if (!put('{')) return false;
    let first = true;
    for (const k in x as Record<string, unknown>) {
      if (!Object.prototype.hasOwnProperty.call(x, k)) continue;
      if (!first && !put(',')) return false;
      first = false;
      if (!put(escapedString(k, budget) + ':')) return false;
      if (!walk((x as Record<string, unknown>)[k], depth + 1)) return false;
    }
    return put('}');
  };
  walk(v, 0);
  return out.length > max ? `${out.slice(0, max - 3)}...` : out;
}
