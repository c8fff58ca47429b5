/**
 * The CLI's own argument reader. Node's util.parseArgs refuses `--temp -40` as ambiguous, and negative
 * temperatures are the common case for cold service; here a value option takes the next argument as
 * typed, whatever it starts with, unless that argument is itself an option (`--...`).
 */
import { InputError } from '../src/index.js';

/** One option of a command: a text value, or a flag that takes none. */
export interface OptionSpec {
  readonly type: 'string' | 'boolean';
}

export type Options = Readonly<Record<string, OptionSpec>>;
export type Values = Record<string, string | boolean | undefined>;

export interface ReadArgs {
  /** The options given, by name without the dashes; the last of a repeated option wins. */
  readonly values: Values;
  /** --help or -h was given (anywhere an option may stand): the caller prints the usage and nothing else. */
  readonly help: boolean;
}

/** Dashes that word processors and web pages put where two hyphens were typed. */
const LOOK_ALIKE_DASHES = /^[\u2010-\u2015\u2212\uFE58\uFE63\uFF0D]/;

/** A shortened, single-line copy of what was typed, for a message. */
export function shown(text: string, max = 60): string {
  const flat = text.replace(/[\u0000-\u001f\u007f]+/g, ' ');
  return flat.length > max ? `${flat.slice(0, max)}...` : flat;
}

/** The option names of a command, for messages: '--family, --temp, --json, --help'. */
export function optionList(options: Options): string {
  return [...Object.keys(options), 'help'].map((k) => `--${k}`).join(', ');
}

/**
 * Reads a command's arguments: `--name value`, `--name=value`, `--flag`, `--help` / `-h`, and `--` (after
 * which nothing may follow, as there are no positional arguments). Throws an InputError naming the
 * option for an unknown option, a missing value, a value given to a flag or a stray argument; --help
 * anywhere wins over such errors.
 */
export function readArgs(args: readonly string[], options: Options, command: string): ReadArgs {
  const values: Values = Object.create(null) as Values;
  let help = false;
  let problem: InputError | null = null;
  const refuse = (e: InputError): void => {
    problem ??= e;
  };
  const firstText = Object.keys(options).find((k) => options[k]?.type === 'string');
  const example = firstText === undefined ? '' : `; a value follows its option, such as --${firstText} VALUE`;
  const stray = (token: string): InputError => {
    const hint = LOOK_ALIKE_DASHES.test(token) ? '; options start with two plain hyphens (--), not a typographic dash' : example;
    return new InputError(`'${shown(token)}'`, `unexpected argument${hint}`);
  };

  for (let i = 0; i < args.length; i++) {
    const token = args[i] ?? '';
    if (token === '--help' || token === '-h') {
      help = true;
      continue;
    }
    if (token === '--') {
      for (const rest of args.slice(i + 1)) refuse(stray(rest));
      break;
    }
    if (/^-[A-Za-z]/.test(token)) {
      refuse(new InputError(`${shown(token, 40)}`, `unknown option; ${command} takes ${optionList(options)}`));
      continue;
    }
    if (!token.startsWith('--')) {
      refuse(stray(token));
      continue;
    }
    const eq = token.indexOf('=');
    const name = eq < 0 ? token.slice(2) : token.slice(2, eq);
    const inline = eq < 0 ? undefined : token.slice(eq + 1);
    const spec = Object.hasOwn(options, name) ? options[name] : undefined;
    if (spec === undefined) {
      refuse(new InputError(`--${shown(name, 40)}`, `unknown option; ${command} takes ${optionList(options)}`));
      continue;
    }
    if (spec.type === 'boolean') {
      if (inline !== undefined) refuse(new InputError(`--${name}`, `takes no value, got '${shown(inline)}'`));
      else values[name] = true;
      continue;
    }
    if (inline !== undefined) {
      values[name] = inline;
      continue;
    }
    const next = args[i + 1];
    if (next === undefined || next.startsWith('--')) {
      refuse(new InputError(`--${name}`, `needs a value: --${name} VALUE or --${name}=VALUE`));
      continue;
    }
    values[name] = next;
    i++;
  }
  if (!help && problem !== null) throw problem;
  return { values, help };
}
