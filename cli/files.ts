/**
 * Files the CLI reads (--params, --data) and writes (--out, --workbook): every failure becomes one
 * InputError naming the option and saying what is wrong with the path, never a raw Node error.
 */
import { readFileSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { InputError } from '../src/index.js';
import { shown } from './args.js';

function codeOf(e: unknown): string {
  return e instanceof Error && 'code' in e && typeof e.code === 'string' ? e.code : '';
}

/** What went wrong with a path, in words, from a Node file-system error. */
function problemWith(e: unknown, file: string, doing: 'read' | 'write', sample = 'record.json'): string {
  const f = `'${shown(file, 200)}'`;
  switch (codeOf(e)) {
    case 'ENOENT':
      return doing === 'read' ? `no file ${f}` : `cannot write ${f}: the folder '${shown(dirname(file), 200)}' does not exist`;
    case 'EISDIR':
      return `${f} is a folder; give a file name${doing === 'write' ? `, such as '${shown(join(file, sample), 200)}'` : ''}`;
    case 'ENOTDIR':
    case 'EEXIST':
      return `cannot ${doing} ${f}: a part of the path before the file name is a file, not a folder`;
    case 'EACCES':
    case 'EPERM':
      return `no permission to ${doing} ${f}`;
    case 'EROFS':
      return `cannot write ${f}: the file system is read-only`;
    case 'ENOSPC':
      return `cannot write ${f}: the disk is full`;
    case 'ENAMETOOLONG':
      return `the path ${f} is too long`;
    default:
      return `cannot ${doing} ${f}: ${e instanceof Error ? e.message : String(e)}`;
  }
}

/** A file's text (UTF-8, a leading byte-order mark removed); InputError naming `option` when it cannot be read. */
export function readTextFile(file: string, option: string): string {
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch (e) {
    throw new InputError(option, problemWith(e, file, 'read'));
  }
  // Windows editors save "Unicode" as UTF-16 with a byte-order mark; say so rather than fail on garbage.
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    throw new InputError(option, `'${shown(file, 200)}' is UTF-16 text; save it as UTF-8`);
  }
  const text = bytes.toString('utf8');
  return text.startsWith('\uFEFF') ? text.slice(1) : text;
}

/**
 * Refuses, before any work is done, an output path that cannot be written: a folder, or a file in a
 * folder that does not exist. The write itself can still fail (permissions, disk full): see writeTextFile.
 */
export function checkWritable(file: string, option: string, sample = 'record.json'): void {
  if (file.trim() === '') throw new InputError(option, 'needs a file name');
  const isFolder = (path: string): boolean | null => {
    try {
      return statSync(path).isDirectory();
    } catch {
      return null;
    }
  };
  const refuse = (code: string): InputError =>
    new InputError(option, problemWith(Object.assign(new Error(code), { code }), file, 'write', sample));
  if (isFolder(file) === true) throw refuse('EISDIR');
  const folder = isFolder(dirname(file));
  if (folder === null) throw refuse('ENOENT');
  if (folder === false) throw refuse('ENOTDIR');
}

/** Writes a text file (replacing one that is there); InputError naming `option` when it cannot. */
export function writeTextFile(file: string, text: string, option: string): void {
  checkWritable(file, option);
  try {
    writeFileSync(file, text);
  } catch (e) {
    throw new InputError(option, problemWith(e, file, 'write'));
  }
}

/** Runs a write that Node reports by throwing or rejecting, turning a file-system error into an InputError naming `option`. */
export async function writingTo<T>(file: string, option: string, sample: string, write: () => Promise<T>): Promise<T> {
  try {
    return await write();
  } catch (e) {
    if (codeOf(e) === '') throw e;
    throw new InputError(option, problemWith(e, file, 'write', sample));
  }
}

/** Where a JSON text first breaks the grammar of RFC 8259, or null if it follows it. */
export function jsonSyntaxError(text: string): { offset: number; problem: string } | null {
  const n = text.length;
  let i = 0;
  const stack: ('{' | '[')[] = [];
  const fail = (problem: string): { offset: number; problem: string } => ({ offset: Math.min(i, n), problem });
  const skipSpace = (): void => {
    while (i < n && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++;
  };
  /** Moves past a string starting at i; returns a problem, or null. */
  const string = (): string | null => {
    i++;
    for (;;) {
      if (i >= n) return 'the text ends inside a string';
      const c = text.charCodeAt(i);
      if (c === 0x22) {
        i++;
        return null;
      }
      if (c < 0x20) return 'a control character (such as a line break) inside a string';
      if (c === 0x5c) {
        const e = text[i + 1] ?? '';
        if ('"\\/bfnrt'.includes(e) && e !== '') i += 2;
        else if (e === 'u' && /^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6))) i += 6;
        else return `a bad escape '\\${e}' inside a string`;
        continue;
      }
      i++;
    }
  };
  const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
  let state: 'value' | 'key' | 'after' = 'value';
  if (text.trim() === '') return { offset: 0, problem: 'the file is empty' };
  for (;;) {
    skipSpace();
    const c = text[i];
    if (state === 'value') {
      if (c === undefined) return fail('the text ends where a value is expected');
      if (c === '{' || c === '[') {
        i++;
        skipSpace();
        if (text[i] === (c === '{' ? '}' : ']')) {
          i++;
          state = 'after';
        } else {
          stack.push(c);
          state = c === '{' ? 'key' : 'value';
        }
      } else if (c === '"') {
        const p = string();
        if (p !== null) return fail(p);
        state = 'after';
      } else if (c === '-' || (c >= '0' && c <= '9')) {
        NUMBER.lastIndex = i;
        const m = NUMBER.exec(text);
        if (m === null) return fail(`a malformed number`);
        i += m[0].length;
        state = 'after';
      } else {
        const word = ['true', 'false', 'null'].find((w) => text.startsWith(w, i));
        if (word === undefined) {
          const afterComma = (c === ']' || c === '}') && text.slice(0, i).trimEnd().endsWith(',');
          const hint =
            c === "'" ? ' (JSON strings use double quotes)' : afterComma ? ' (JSON allows no comma before a closing bracket)' : '';
          return fail(`unexpected '${shown(c)}' where a value is expected${hint}`);
        }
        i += word.length;
        state = 'after';
      }
    } else if (state === 'key') {
      if (c !== '"') {
        const hint = c === '}' ? ' (JSON allows no comma before a closing brace)' : '';
        return fail(
          c === undefined ? 'the text ends where a property name is expected' : `expected a property name in double quotes${hint}`,
        );
      }
      const p = string();
      if (p !== null) return fail(p);
      skipSpace();
      if (text[i] !== ':') return fail("expected ':' after the property name");
      i++;
      state = 'value';
    } else {
      const top = stack[stack.length - 1];
      if (top === undefined) return c === undefined ? null : fail('unexpected text after the end of the JSON value');
      const close = top === '{' ? '}' : ']';
      if (c === undefined) return fail(`the text ends inside ${top === '{' ? 'an object' : 'a list'} (a '${close}' is missing)`);
      if (c === ',') {
        i++;
        state = top === '{' ? 'key' : 'value';
      } else if (c === close) {
        i++;
        stack.pop();
      } else {
        return fail(`expected ',' or '${close}'`);
      }
    }
  }
}

/** 1-based line and column of a character offset. */
export function lineColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - (before.lastIndexOf('\n') + 1) + 1 };
}

/** The JSON value in a file; InputError naming `option`, the file and the line and column of a syntax error. */
export function readJsonFile(file: string, option: string): unknown {
  const text = readTextFile(file, option);
  try {
    return JSON.parse(text);
  } catch (e) {
    const where = jsonSyntaxError(text);
    if (where === null) throw new InputError(option, `cannot read JSON from '${shown(file, 200)}': ${(e as Error).message}`);
    const { line, column } = lineColumn(text, where.offset);
    throw new InputError(option, `'${shown(file, 200)}' is not valid JSON at line ${line}, column ${column}: ${where.problem}`);
  }
}
