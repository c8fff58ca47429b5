/**
 * A small evaluator for the literal-only DERATE.* formulas of the fixture table, so the same rows can be
 * run straight through the wrappers (as Excel would call them) and through HyperFormula. Supports
 * numbers, "text" ("" escapes a quote), TRUE()/FALSE(), left-out arguments, {a,b;c,d} arrays and nested
 * DERATE.* calls.
 */
import { definition } from '../../functions/core/define.js';

type Node = number | string | boolean | undefined | Node[][] | Call;
interface Call {
  readonly id: string;
  readonly args: Node[];
}

class Parser {
  private i = 0;
  constructor(private readonly s: string) {}

  private peek(): string {
    return this.s[this.i] ?? '';
  }
  private skip(): void {
    while (this.peek() === ' ') this.i++;
  }
  private expect(c: string): void {
    this.skip();
    if (this.peek() !== c) throw new Error(`formula: expected '${c}' at ${this.i} in ${this.s}`);
    this.i++;
  }

  call(): Call {
    this.skip();
    const m = /^DERATE\.([A-Z]+)\(/.exec(this.s.slice(this.i));
    if (!m || m[1] === undefined) throw new Error(`formula: expected DERATE.NAME( at ${this.i} in ${this.s}`);
    this.i += m[0].length;
    const args: Node[] = [];
    this.skip();
    if (this.peek() === ')') {
      this.i++;
      return { id: m[1], args };
    }
    for (;;) {
      args.push(this.value());
      this.skip();
      const c = this.peek();
      this.i++;
      if (c === ')') return { id: m[1], args };
      if (c !== ',') throw new Error(`formula: expected ',' or ')' at ${this.i - 1} in ${this.s}`);
    }
  }

  value(): Node {
    this.skip();
    const c = this.peek();
    if (c === ',' || c === ')') return undefined;
    if (c === '"') return this.text();
    if (c === '{') return this.array();
    const rest = this.s.slice(this.i);
    if (rest.startsWith('TRUE()')) return ((this.i += 6), true);
    if (rest.startsWith('FALSE()')) return ((this.i += 7), false);
    if (rest.startsWith('DERATE.')) return this.call();
    const m = /^-?\d+(\.\d+)?([eE][-+]?\d+)?/.exec(rest);
    if (!m) throw new Error(`formula: cannot read a value at ${this.i} in ${this.s}`);
    this.i += m[0].length;
    return Number(m[0]);
  }

  private text(): string {
    this.i++;
    let out = '';
    for (;;) {
      const c = this.peek();
      if (c === '') throw new Error(`formula: unterminated text in ${this.s}`);
      this.i++;
      if (c === '"') {
        if (this.peek() === '"') {
          out += '"';
          this.i++;
          continue;
        }
        return out;
      }
      out += c;
    }
  }

  private array(): Node[][] {
    this.i++;
    const rows: Node[][] = [[]];
    for (;;) {
      rows[rows.length - 1]?.push(this.value());
      this.skip();
      const c = this.peek();
      this.i++;
      if (c === '}') return rows;
      if (c === ';') rows.push([]);
      else if (c !== ',') throw new Error(`formula: expected ',', ';' or '}' in ${this.s}`);
    }
  }
}

/** Parses `=DERATE.X(...)` or `DERATE.X(...)`. */
export function parseFormula(formula: string): Call {
  const p = new Parser(formula.replace(/^=/, ''));
  return p.call();
}

function isCall(n: Node): n is Call {
  return typeof n === 'object' && n !== null && !Array.isArray(n);
}

function evaluateNode(n: Node): unknown {
  if (isCall(n)) return evaluateCall(n);
  if (Array.isArray(n)) return n.map((row) => row.map(evaluateNode));
  return n;
}

function evaluateCall(c: Call): unknown {
  const def = definition(c.id);
  if (!def) throw new Error(`no worksheet function DERATE.${c.id}`);
  return def.invoke(...c.args.map(evaluateNode));
}

/** Evaluates a literal-only formula straight through the wrappers. */
export function evaluateFormula(formula: string): unknown {
  return evaluateCall(parseFormula(formula));
}
