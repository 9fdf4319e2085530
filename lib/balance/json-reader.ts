// A small JSON reader that keeps every number's literal digits. JSON.parse would turn
// "0.1" into a binary double before we could see it; Node 20 also has no reviver
// `context.source`. So numbers come back as JsonNumber objects holding the source text,
// which the schema then reads straight into Decimal.

export class JsonNumber {
  constructor(readonly text: string) {}
  toString(): string {
    return this.text;
  }
}

export type JsonValue = null | boolean | string | JsonNumber | JsonValue[] | { [key: string]: JsonValue };

export class JsonSyntaxError extends Error {
  constructor(
    readonly reason: string,
    readonly position: number,
    readonly line: number,
    readonly column: number,
  ) {
    super(`bad JSON at line ${line} column ${column} (position ${position}): ${reason}`);
    this.name = "JsonSyntaxError";
  }
}

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const ESCAPES: Record<string, string> = { '"': '"', "\\": "\\", "/": "/", b: "\b", f: "\f", n: "\n", r: "\r", t: "\t" };
/**
 * Deepest nesting accepted. A plant-month is five levels deep; the reader recurses per level, so
 * without a bound a body of "[[[[…" would overflow the stack (a RangeError, not a JSON error).
 */
export const MAX_JSON_DEPTH = 256;

/** Parses JSON text; numbers become JsonNumber (literal kept), everything else as JSON.parse. */
export function readJson(text: string): JsonValue {
  // A UTF-8 byte-order mark some editors write: RFC 8259 §8.1 lets a parser ignore it.
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;

  const fail = (reason: string, at = i): never => {
    const before = text.slice(0, at).split("\n");
    throw new JsonSyntaxError(reason, at, before.length, before[before.length - 1].length + 1);
  };
  const skip = () => {
    while (i < text.length && " \t\n\r".includes(text[i])) i++;
  };
  // A character that prints as nothing (or as another) is named by its code point.
  const describe = () => {
    if (i >= text.length) return "end of input";
    const cp = text.codePointAt(i)!;
    return cp < 0x20 || (cp >= 0x7f && cp <= 0xa0) || cp === 0xfeff || (cp >= 0x2000 && cp <= 0x206f) || cp > 0xffff
      ? `U+${cp.toString(16).toUpperCase().padStart(4, "0")}`
      : `'${text[i]}'`;
  };

  const readString = (): string => {
    const start = i;
    i++; // opening quote
    let out = "";
    while (true) {
      if (i >= text.length) fail("unterminated string");
      const ch = text[i];
      if (ch === '"') {
        // JSON allows "\ud800" alone, but it is no character: it cannot be stored (jsonb refuses
        // it), printed or signed, so it is refused here with its place (RFC 7493, I-JSON, 2.1).
        if (!out.isWellFormed()) fail("a \\u escape leaves a lone UTF-16 surrogate (not a Unicode character)", start);
        i++;
        return out;
      }
      if (ch === "\\") {
        const esc = text[i + 1];
        if (esc === "u") {
          const hex = text.slice(i + 2, i + 6);
          if (!/^[0-9a-fA-F]{4}$/.test(hex)) fail("bad \\u escape");
          out += String.fromCharCode(parseInt(hex, 16));
          i += 6;
        } else if (esc !== undefined && esc in ESCAPES) {
          out += ESCAPES[esc];
          i += 2;
        } else fail("bad escape in string");
      } else if (ch < " ") fail("control character in string");
      else {
        out += ch;
        i++;
      }
    }
  };

  let depth = 0;
  const readValue = (): JsonValue => {
    if (++depth > MAX_JSON_DEPTH) fail(`nested deeper than ${MAX_JSON_DEPTH} levels`);
    try {
      return readNested();
    } finally {
      depth--;
    }
  };

  const readNested = (): JsonValue => {
    skip();
    const ch = text[i];
    if (ch === "{") {
      i++;
      const obj: { [key: string]: JsonValue } = {};
      skip();
      if (text[i] === "}") {
        i++;
        return obj;
      }
      while (true) {
        skip();
        if (text[i] !== '"') fail(`expected a property name, found ${describe()}`);
        const keyAt = i;
        const key = readString();
        // The last of two equal keys would silently win; in a record of account that hides a figure (RFC 8259, 4).
        if (Object.prototype.hasOwnProperty.call(obj, key)) fail(`duplicate property name ${JSON.stringify(key)}`, keyAt);
        skip();
        if (text[i] !== ":") fail(`expected ':' after property name, found ${describe()}`);
        i++;
        // defineProperty so a key named __proto__ stays a plain data key
        Object.defineProperty(obj, key, { value: readValue(), enumerable: true, writable: true, configurable: true });
        skip();
        if (text[i] === ",") i++;
        else if (text[i] === "}") {
          i++;
          return obj;
        } else fail(`expected ',' or '}', found ${describe()}`);
      }
    }
    if (ch === "[") {
      i++;
      const arr: JsonValue[] = [];
      skip();
      if (text[i] === "]") {
        i++;
        return arr;
      }
      while (true) {
        arr.push(readValue());
        skip();
        if (text[i] === ",") i++;
        else if (text[i] === "]") {
          i++;
          return arr;
        } else fail(`expected ',' or ']', found ${describe()}`);
      }
    }
    if (ch === '"') return readString();
    for (const [word, value] of [["true", true], ["false", false], ["null", null]] as const) {
      if (text.startsWith(word, i)) {
        i += word.length;
        return value;
      }
    }
    NUMBER.lastIndex = i;
    const m = NUMBER.exec(text);
    if (m) {
      i += m[0].length;
      return new JsonNumber(m[0]);
    }
    return fail(`unexpected ${describe()}`);
  };

  const value = readValue();
  skip();
  if (i < text.length) fail(`unexpected ${describe()} after the JSON value`);
  return value;
}
