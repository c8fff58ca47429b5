/**
 * How a failed command is reported: one stderr line naming the option the problem came from, and an
 * exit code by kind (README "Command-line tool"). Engine errors name engine arguments ('temperature',
 * 'free', 'Tm'); the tables here turn them into the options a user typed, without touching the
 * engine's own words.
 */
import { InputError, ParameterError, SolverError, UnknownFamilyError } from '../src/index.js';
import { shown, type Values } from './args.js';
import { opt, paramsFileError, type Command, type OptionName } from './command.js';

/** Exit codes: 70 is EX_SOFTWARE, "internal software error", of BSD's sysexits.h (from memory). */
export const EXIT = {
  /** An answer (a "not reached" verdict is an answer too, carried in the output). */
  answer: 0,
  /** Valid input, but the model gives no answer: a solver did not converge. */
  noAnswer: 1,
  /** Bad input: a command, an option, a value, or a file that cannot be read or written. */
  badInput: 2,
  /** A fault of the program itself. */
  internal: 70,
} as const;

/** Engine argument names shared by many commands, and the option (without dashes) each comes from where the command has it. */
const ENGINE_NAMES: Readonly<Record<string, string>> = {
  temperature: 'temp',
  time: 'time',
  modulus: 'modulus',
  stress: 'stress',
  strain: 'strain',
  data: 'data',
  header: 'data',
  free: 'free',
  start: 'params',
  frequency: 'frequency',
  ref_temperature: 'ref',
  cycles: 'cycles',
};

/** The option an engine argument name came from in this command, or null when it names none. */
function optionFor(argument: string, command: Command, v: Values): string | null {
  const own: OptionName | undefined = command.names && Object.hasOwn(command.names, argument) ? command.names[argument] : undefined;
  if (own !== undefined) return typeof own === 'string' ? own : own(v);
  const shared = Object.hasOwn(ENGINE_NAMES, argument) ? ENGINE_NAMES[argument] : undefined;
  return shared !== undefined && Object.hasOwn(command.options, shared) ? `--${shared}` : null;
}

/** An unexpected error in one line for a report: its class and message. */
export function describeFault(e: unknown): string {
  if (e instanceof Error) return `${e.name === 'Error' ? '' : `${e.name}: `}${e.message}`;
  return String(e);
}

/** One line, at most `max` characters: a message may quote what was typed, which may be long or hold line breaks. */
export function oneLine(text: string, max = 1000): string {
  const flat = text.replace(/\s*[\r\n]+\s*/g, ' ').replace(/[\u0000-\u001f\u007f]/g, ' ');
  return flat.length > max ? `${flat.slice(0, max)}...` : flat;
}

/** The exit code and the message of a failure of `command` run with the options `v`. */
export function failure(e: unknown, command: Command, v: Values): { code: number; message: string } {
  if (e instanceof InputError) {
    const option = e.argument.startsWith('--') ? null : optionFor(e.argument, command, v);
    return { code: EXIT.badInput, message: option === null ? e.message : `${option}: ${e.problem}` };
  }
  if (e instanceof ParameterError) {
    const file = opt(v, 'params');
    return { code: EXIT.badInput, message: file === undefined ? e.message : paramsFileError(shown(file, 200), e).message };
  }
  if (e instanceof UnknownFamilyError) {
    const option = ['family', 'families'].find((k) => Object.hasOwn(command.options, k));
    return { code: EXIT.badInput, message: option === undefined ? e.message : `--${option}: ${e.message}` };
  }
  if (e instanceof SolverError) return { code: EXIT.noAnswer, message: `no answer: ${e.message}` };
  return { code: EXIT.internal, message: `internal error (please report): ${describeFault(e)}` };
}
