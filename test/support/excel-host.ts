/**
 * The host side of Office.js for tests: an in-memory workbook that answers the JSON requests Microsoft's
 * Excel client (test/support/office-js.ts) sends on context.sync(), so that everything above the transport
 * is the real client. Longer than 400 lines because the protocol and the workbook objects the Office
 * adapter touches belong together.
 *
 * The wire format is the one the client builds (OfficeExtension ClientRequest.buildRequestMessageBody-
 * AndRequestFlags, read in @microsoft/office-js 1.1.110): a body of ObjectPaths (id -> GlobalObject 1,
 * Method 3, Property 4, Indexer 5, ReferenceId 6, NullObject 7, each with its parent and arguments) and
 * Actions (Instantiate 1, Query 2, Method 3, SetProperty 4, Trace 5) run in order; the answer is
 * { Results: [{ ActionId, Value }], TraceIds, Error: { Code, Message, Location, ActionIndex } }, with
 * PascalCase property names and collections as { _Items: [...] } (what the client's _handleResult reads).
 * The host executes actions until one fails: what ran before stays, the rest does not run (as the recorded-
 * call fake did; Excel's behaviour from memory). Members the adapter does not use are refused loudly, so
 * a new call in the adapter fails here until it is modelled.
 */
import { excelApiSets, newerThan } from './excel-api-sets.js';
import type { OfficeJs } from './office-js.js';

export type Value = string | number | boolean;

export interface HostCell {
  /** What was entered: a constant, or formula text starting with '='. */
  formula: Value;
  format: string;
}

export interface HostSeries {
  name: string;
  x: string | null;
  y: string | null;
  lineStyle: string;
  markerStyle: string;
}

export interface HostChart {
  readonly id: string;
  name: string;
  readonly type: string;
  readonly source: string;
  readonly seriesBy: string;
  title: string;
  readonly series: HostSeries[];
  readonly valueAxis: { scaleType: string; logBase: number; minimum: number | null; title: string };
  readonly categoryAxis: { title: string };
  legend: string;
  position: [string, string] | null;
}

export interface HostSheet {
  readonly id: string;
  name: string;
  readonly cells: Map<string, HostCell>;
  readonly charts: HostChart[];
}

interface Box {
  top: number;
  left: number;
  bottom: number;
  right: number;
}

/** An error Excel would report for one action: code (Excel.ErrorCodes) and message. */
export class HostError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

const key = (r: number, c: number): string => `${r},${c}`;

function column(c: number): string {
  let s = '';
  for (let n = c + 1; n > 0; n = Math.floor((n - 1) / 26)) s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
  return s;
}

/** A1 text of a box, one cell as "B2" (Excel's Range.address form, without the sheet). */
function a1(b: Box): string {
  const tl = `${column(b.left)}${b.top + 1}`;
  return b.top === b.bottom && b.left === b.right ? tl : `${tl}:${column(b.right)}${b.bottom + 1}`;
}

/** Sheet name as Excel writes it in an address: quoted unless letters, digits and underscores only. */
function sheetPrefix(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_]*$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

/** Parses "B2", "$B$2", "B2:C9" (no sheet): our own reader, independent of addin/a1.ts. */
function parseBox(address: string): Box {
  const m = /^\$?([A-Z]{1,3})\$?(\d+)(?::\$?([A-Z]{1,3})\$?(\d+))?$/i.exec(address.trim());
  if (!m) throw new HostError('InvalidArgument', `The argument is invalid or missing or has an incorrect format: '${address}'`);
  const col = (s: string): number => [...s.toUpperCase()].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0) - 1;
  const r1 = Number(m[2]) - 1;
  const c1 = col(m[1] ?? 'A');
  const r2 = m[4] === undefined ? r1 : Number(m[4]) - 1;
  const c2 = m[3] === undefined ? c1 : col(m[3]);
  return { top: Math.min(r1, r2), left: Math.min(c1, c2), bottom: Math.max(r1, r2), right: Math.max(c1, c2) };
}

/**
 * What a cell holds after text is entered through Range.formulas or values. A leading "=", "+" or "-" makes
 * a formula (Microsoft Learn, "Excel.Range class", values: "If the returned value starts with a plus, minus,
 * or equal sign, Excel interprets this value as a formula"); a leading apostrophe keeps text as text and is
 * not part of the value (from memory: Excel's prefix character); number and TRUE/FALSE text is read as a
 * number or boolean, as typing it would be (from memory: the lost leading zero of "007").
 */
function entered(v: Value): Value {
  if (typeof v !== 'string') return v;
  if (v.startsWith("'")) return v;
  if (/^[=+-]/.test(v) && !/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(v)) return v.startsWith('=') ? v : `=${v}`;
  const t = v.trim();
  if (/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return Number(t);
  if (/^(true|false)$/i.test(t)) return t.toLowerCase() === 'true';
  return v;
}

export interface HostOptions {
  /** The host's ExcelApi requirement-set level: members newer than it are refused with ApiNotFound. Default: all. */
  readonly excelApi?: string;
  /** The value a formula cell shows; the host does not calculate (default: the text Excel shows for an unknown name). */
  readonly calculate?: (formula: string) => Value;
}

/**
 * The in-memory workbook and the request executor the real client talks to. `requests` keeps every request
 * body as sent (after a JSON round trip, as over a wire) for tests that count batches.
 */
export class ExcelHost {
  readonly sheets: HostSheet[] = [];
  readonly requests: RequestBody[] = [];
  selection: { sheet: string; box: Box };
  active: string;
  /** Makes the first action whose "Class.Member" matches fail with GeneralException (e.g. 'ChartSeries.SetXAxisValues'). */
  failOn: string | null = null;
  /** Objects kept across requests by _KeepReference, by the reference id handed to the client. */
  readonly references = new Map<string, HostNode>();
  private nextId = 1;
  private readonly handlers = new Map<number, ((args: unknown) => void)[]>();
  private readonly calculate: (formula: string) => Value;
  private readonly excelApi: string | null;

  constructor(
    readonly client: OfficeJs,
    names: string[] = ['Sheet1'],
    options: HostOptions = {},
  ) {
    for (const n of names) this.sheets.push(this.newSheet(n));
    this.active = names[0] ?? 'Sheet1';
    this.selection = { sheet: this.active, box: { top: 0, left: 0, bottom: 0, right: 0 } };
    this.calculate = options.calculate ?? (() => '#NAME?');
    this.excelApi = options.excelApi ?? null;
  }

  /** Refuses a member newer than the host's level, as an older Excel would (the error code from memory). */
  gate(kind: string, member: string): void {
    if (this.excelApi === null) return;
    const name = `${kind}.${member.charAt(0).toLowerCase()}${member.slice(1)}`;
    const needs = excelApiSets().get(name);
    if (needs !== undefined && newerThan(needs, this.excelApi))
      throw new HostError('ApiNotFound', `${name} is part of ExcelApi ${needs}; this host supports ExcelApi ${this.excelApi}`);
  }

  private newSheet(name: string): HostSheet {
    return { id: `{00000000-0001-0000-${String(this.nextId++).padStart(4, '0')}-000000000000}`, name, cells: new Map(), charts: [] };
  }

  sheet(name: string): HostSheet {
    const s = this.sheets.find((x) => x.name.toLowerCase() === name.toLowerCase() || x.id === name);
    if (!s) throw new HostError('ItemNotFound', `The requested resource doesn't exist: worksheet '${name}'`);
    return s;
  }

  /** Test helper: what a user typed into a cell. */
  put(sheet: string, address: string, v: Value): void {
    const b = parseBox(address);
    this.sheet(sheet).cells.set(key(b.top, b.left), { formula: entered(v), format: 'General' });
  }

  /** Test helper: a cell as stored, or undefined when it holds nothing and has the default format. */
  at(sheet: string, address: string): (HostCell & { value: Value }) | undefined {
    const b = parseBox(address);
    const c = this.sheet(sheet).cells.get(key(b.top, b.left));
    return c && { ...c, value: this.valueOf(c) };
  }

  valueOf(c: HostCell): Value {
    if (typeof c.formula === 'string' && c.formula.startsWith('=')) return this.calculate(c.formula);
    return typeof c.formula === 'string' && c.formula.startsWith("'") ? c.formula.slice(1) : c.formula;
  }

  /** What the user does in Excel: select other cells; Excel raises DocumentSelectionChanged (event id 2). */
  select(sheet: string, address: string): void {
    this.selection = { sheet: this.sheet(sheet).name, box: parseBox(address) };
    for (const h of this.handlers.get(2) ?? []) h({});
  }

  /** The session to pass to Excel.run: it supplies our executor and our event registration. */
  session(): object {
    const Base = (this.client.OfficeExtension as unknown as { SessionBase: new () => object }).SessionBase;
    const executor = { executeAsync: (_custom: unknown, _flags: number, message: { Body: unknown }) => this.executeAsync(message.Body) };
    type Handler = (args: unknown) => void;
    const registration = {
      register: (eventId: number, _target: string, handler: Handler): Promise<void> => {
        if (eventId !== 2) return Promise.reject(new HostError('NotImplemented', `the test host raises no event ${eventId}`));
        try {
          this.gate('Workbook', 'onSelectionChanged');
        } catch (e) {
          return Promise.reject(e);
        }
        this.handlers.set(eventId, [...(this.handlers.get(eventId) ?? []), handler]);
        return Promise.resolve();
      },
      unregister: (eventId: number, _target: string, handler: Handler): Promise<void> => {
        this.handlers.set(
          eventId,
          (this.handlers.get(eventId) ?? []).filter((h) => h !== handler),
        );
        return Promise.resolve();
      },
    };
    // The client's SessionBase hooks: where to send requests, which executor, which event registration.
    class HostSession extends Base {
      _resolveRequestUrlAndHeaderInfo(): Promise<{ url: string; headers: Record<string, string> }> {
        return Promise.resolve({ url: 'test-host://workbook', headers: {} });
      }
      _createRequestExecutorOrNull(): object {
        return executor;
      }
      getEventRegistration(): object {
        return registration;
      }
    }
    return new HostSession();
  }

  /** The runner for OfficeSheet: Microsoft's Excel.run with this host's session. */
  readonly run = <T>(batch: (context: Excel.RequestContext) => Promise<T>): Promise<T> =>
    this.client.Excel.run(this.session() as Excel.RequestContext, batch);

  private executeAsync(body: unknown): Promise<object> {
    const request = JSON.parse(JSON.stringify(body)) as RequestBody;
    this.requests.push(request);
    const answer = new Batch(this, request).execute();
    return Promise.resolve({ HttpStatusCode: 200, ErrorCode: '', ErrorMessage: '', Headers: {}, Body: JSON.parse(JSON.stringify(answer)) });
  }

  /** The requests sent by the adapter's own context.sync() calls, without Excel.run's clean-up requests. */
  get syncs(): RequestBody[] {
    return this.requests.filter((r) => r.Actions.some((a) => a.ActionType !== 1 && a.Name !== '_RemoveReference'));
  }

  /** Keeps an object for later requests (the client's _KeepReference) and names it. */
  keep(node: HostNode): string {
    for (const [id, n] of this.references) if (n === node) return id;
    const id = `{ref-${this.nextId++}}`;
    this.references.set(id, node);
    return id;
  }

  /** A value of one of the client's own enums (Excel.ChartType, ...), else InvalidArgument. */
  checkEnum(name: string, v: unknown): string {
    const values = Object.values((this.client.Excel as unknown as Record<string, Record<string, string>>)[name] ?? {});
    if (typeof v !== 'string' || !values.includes(v))
      throw new HostError('InvalidArgument', `'${String(v)}' is not a value of Excel.${name}`);
    return v;
  }

  addSheet(name: unknown): HostSheet {
    const n = typeof name === 'string' && name !== '' ? name : `Sheet${this.sheets.length + 1}`;
    // Excel's sheet-name rules (from memory: at most 31 characters, none of : \ / ? * [ ]).
    if (n.length > 31 || /[:\\/?*[\]]/.test(n)) throw new HostError('InvalidArgument', `'${n}' is not a valid worksheet name`);
    if (this.sheets.some((s) => s.name.toLowerCase() === n.toLowerCase()))
      throw new HostError('ItemAlreadyExists', `A resource with the same name or identifier already exists: '${n}'`);
    const s = this.newSheet(n);
    this.sheets.push(s);
    return s;
  }

  newChart(sheet: HostSheet, type: string, source: HostNode, seriesBy: string): HostChart {
    if (!(source instanceof RangeNode)) throw new HostError('InvalidArgument', 'charts.add needs a range as its source');
    const chart: HostChart = {
      id: `{chart-${this.nextId++}}`,
      name: `Chart ${sheet.charts.length + 1}`,
      type,
      source: source.qualified(),
      seriesBy,
      title: '',
      series: [{ name: 'Series1', x: null, y: source.qualified(), lineStyle: 'Continuous', markerStyle: 'Automatic' }],
      valueAxis: { scaleType: 'Linear', logBase: 10, minimum: null, title: '' },
      categoryAxis: { title: '' },
      legend: 'Right',
      position: null,
    };
    sheet.charts.push(chart);
    return chart;
  }
}

interface ObjectPathInfo {
  Id: number;
  ObjectPathType: number;
  Name: string;
  ParentObjectPathId?: number;
  ArgumentInfo?: { Arguments?: unknown[]; ReferencedObjectPathIds?: unknown[] };
}

interface ActionInfo {
  Id: number;
  ActionType: number;
  Name: string;
  ObjectPathId: number;
  ArgumentInfo?: { Arguments?: unknown[]; ReferencedObjectPathIds?: unknown[] };
  QueryInfo?: { Select?: string[] };
}

export interface RequestBody {
  Actions: ActionInfo[];
  ObjectPaths: Record<string, ObjectPathInfo>;
}

/** One request: object paths resolved once each (a Method path such as worksheets.add runs when instantiated). */
class Batch {
  private readonly resolved = new Map<number, HostNode | null>();
  constructor(
    private readonly host: ExcelHost,
    private readonly body: RequestBody,
  ) {}

  execute(): object {
    const Results: { ActionId: number; Value: unknown }[] = [];
    const TraceIds: number[] = [];
    for (const [index, action] of this.body.Actions.entries()) {
      try {
        const value = this.act(action, TraceIds);
        if (value !== undefined) Results.push({ ActionId: action.Id, Value: value });
      } catch (e) {
        const err = e instanceof HostError ? e : new HostError('GeneralException', e instanceof Error ? e.message : String(e));
        return {
          Results,
          TraceIds,
          Error: { Code: err.code, Message: err.message, Location: action.Name, ActionIndex: index, HttpStatusCode: 400 },
        };
      }
    }
    return { Results, TraceIds };
  }

  private act(a: ActionInfo, traces: number[]): unknown {
    if (a.ActionType === 5) {
      traces.push(a.Id);
      return undefined;
    }
    const target = this.path(a.ObjectPathId);
    switch (a.ActionType) {
      case 1: {
        if (target === null) return null;
        // A kept object answers with its reference id; the client then addresses it by that id (path type 6).
        const ref = [...this.host.references].find(([, n]) => n === target)?.[0];
        return ref === undefined ? target.identity() : { ...target.identity(), _ReferenceId: ref };
      }
      case 2:
        if (target === null) return null;
        for (const n of a.QueryInfo?.Select ?? []) if (!n.includes('/')) this.host.gate(target.kind, n);
        return target.query(a.QueryInfo?.Select);
      case 3: {
        // The client keeps every object it loads, *OrNullObject results included, before it knows they are null.
        if (target === null && a.Name === '_KeepReference') return undefined;
        if (target === null) throw new HostError('InvalidObjectPath', `method ${a.Name} on a null object`);
        if (a.Name === '_KeepReference') {
          this.host.keep(target);
          return undefined;
        }
        this.maybeFail(target, a.Name);
        const out = target.call(a.Name, this.args(a.ArgumentInfo));
        return out instanceof HostNode ? out.identity() : out;
      }
      case 4:
        if (target === null) throw new HostError('InvalidObjectPath', `property ${a.Name} on a null object`);
        this.maybeFail(target, a.Name);
        target.assign(a.Name, this.args(a.ArgumentInfo)[0]);
        return undefined;
      default:
        throw new HostError('NotImplemented', `the test host does not handle action type ${a.ActionType}`);
    }
  }

  private maybeFail(target: HostNode, member: string): void {
    this.host.gate(target.kind, member);
    if (this.host.failOn === `${target.kind}.${member}`)
      throw new HostError('GeneralException', `${target.kind}.${member} failed (test host)`);
  }

  /** Arguments with object-path references (ReferencedObjectPathIds non-zero) replaced by their objects. */
  private args(info: ObjectPathInfo['ArgumentInfo']): unknown[] {
    const args = [...(info?.Arguments ?? [])];
    const refs = info?.ReferencedObjectPathIds ?? [];
    refs.forEach((r, i) => {
      if (typeof r === 'number' && r !== 0) args[i] = this.path(r);
    });
    return args;
  }

  private path(id: number): HostNode | null {
    if (this.resolved.has(id)) return this.resolved.get(id) ?? null;
    const info = this.body.ObjectPaths[String(id)];
    if (!info) throw new HostError('InvalidObjectPath', `object path ${id} is not in the request`);
    const parent = (): HostNode => {
      const p = info.ParentObjectPathId === undefined ? null : this.path(info.ParentObjectPathId);
      if (p === null) throw new HostError('InvalidObjectPath', `object path ${id} has no parent object`);
      return p;
    };
    let out: HostNode | null;
    switch (info.ObjectPathType) {
      case 1:
        out = new WorkbookNode(this.host);
        break;
      case 3: {
        const p = parent();
        this.maybeFail(p, info.Name);
        const r = p.call(info.Name, this.args(info.ArgumentInfo));
        if (r !== null && !(r instanceof HostNode)) throw new HostError('InvalidObjectPath', `${p.kind}.${info.Name} gives no object`);
        out = r;
        break;
      }
      case 4: {
        const p = parent();
        this.host.gate(p.kind, info.Name);
        out = p.property(info.Name);
        break;
      }
      case 5: {
        const p = parent();
        this.host.gate(p.kind, 'getItem');
        out = p.item(this.args(info.ArgumentInfo));
        break;
      }
      case 6: {
        const kept = this.host.references.get(info.Name);
        if (!kept) throw new HostError('InvalidObjectPath', `reference ${info.Name} was released or never handed out`);
        out = kept;
        break;
      }
      case 7:
        out = null;
        break;
      default:
        throw new HostError('NotImplemented', `the test host does not handle object path type ${info.ObjectPathType}`);
    }
    this.resolved.set(id, out);
    return out;
  }
}

/** A host object: navigation properties, methods, indexers, scalar properties (PascalCase, as on the wire). */
abstract class HostNode {
  abstract readonly kind: string;
  /** Scalar properties a load without a select returns. */
  protected readonly scalars: readonly string[] = [];
  constructor(protected readonly host: ExcelHost) {}
  private refuse(member: string): never {
    throw new HostError('NotImplemented', `the test host does not model ${this.kind}.${member}`);
  }
  property(name: string): HostNode {
    return this.refuse(name);
  }
  call(name: string, _args: unknown[]): unknown {
    return this.refuse(`${name}()`);
  }
  item(_args: unknown[]): HostNode | null {
    return this.refuse('[]');
  }
  assign(name: string, _v: unknown): void {
    this.refuse(`${name} =`);
  }
  read(name: string): unknown {
    return this.refuse(name);
  }
  /** What an Instantiate action answers: {} for a plain object (the client keeps its path). */
  identity(): object {
    return {};
  }
  query(select: string[] | undefined): unknown {
    const names = select && select.length > 0 ? select : this.scalars;
    const out: Record<string, unknown> = {};
    for (const n of names) {
      if (n.includes('/')) this.refuse(`load('${n}')`);
      const pascal = n.charAt(0).toUpperCase() + n.slice(1);
      out[pascal] = this.read(pascal);
    }
    return out;
  }
}

class WorkbookNode extends HostNode {
  readonly kind = 'Workbook';
  override property(name: string): HostNode {
    return name === 'Worksheets' ? new WorksheetsNode(this.host) : super.property(name);
  }
  override call(name: string, args: unknown[]): unknown {
    if (name === '_RemoveReference') {
      this.host.references.delete(String(args[0]));
      return null;
    }
    if (name !== 'GetSelectedRange') return super.call(name, args);
    const s = this.host.selection;
    return new RangeNode(this.host, this.host.sheet(s.sheet), s.box);
  }
}

class WorksheetsNode extends HostNode {
  readonly kind = 'WorksheetCollection';
  override item(args: unknown[]): HostNode {
    return new WorksheetNode(this.host, this.host.sheet(String(args[0])));
  }
  override call(name: string, args: unknown[]): unknown {
    if (name === 'Add') return new WorksheetNode(this.host, this.host.addSheet(args[0]));
    if (name === 'GetItem') return this.item(args);
    return super.call(name, args);
  }
  override query(select: string[] | undefined): unknown {
    return { _Items: this.host.sheets.map((s) => new WorksheetNode(this.host, s).query(select)) };
  }
}

abstract class SheetBound extends HostNode {
  constructor(
    host: ExcelHost,
    readonly ws: HostSheet,
  ) {
    super(host);
  }
  /** A deleted sheet's objects fail, as Excel's do. */
  protected live(): HostSheet {
    if (!this.host.sheets.includes(this.ws)) throw new HostError('ItemNotFound', `worksheet '${this.ws.name}' was deleted`);
    return this.ws;
  }
}

class WorksheetNode extends SheetBound {
  readonly kind = 'Worksheet';
  protected override readonly scalars = ['Name', 'Id', 'Position'];
  override identity(): object {
    return { Id: this.live().id };
  }
  override read(name: string): unknown {
    const ws = this.live();
    if (name === 'Name') return ws.name;
    if (name === 'Id') return ws.id;
    if (name === 'Position') return this.host.sheets.indexOf(ws);
    return super.read(name);
  }
  override property(name: string): HostNode {
    return name === 'Charts' ? new ChartsNode(this.host, this.live()) : super.property(name);
  }
  override call(name: string, args: unknown[]): unknown {
    const ws = this.live();
    switch (name) {
      case 'GetRange':
        return new RangeNode(this.host, ws, parseBox(String(args[0])));
      case 'GetUsedRangeOrNullObject':
      case 'GetUsedRange': {
        const valuesOnly = args[0] === true;
        let box: Box | null = null;
        for (const [k, c] of ws.cells) {
          if (valuesOnly && c.formula === '') continue;
          const [r = 0, col = 0] = k.split(',').map(Number);
          box = box
            ? { top: Math.min(box.top, r), left: Math.min(box.left, col), bottom: Math.max(box.bottom, r), right: Math.max(box.right, col) }
            : { top: r, left: col, bottom: r, right: col };
        }
        // An empty sheet's used range is A1 (from memory); the OrNullObject form gives null instead.
        if (box === null) return name === 'GetUsedRange' ? new RangeNode(this.host, ws, { top: 0, left: 0, bottom: 0, right: 0 }) : null;
        return new RangeNode(this.host, ws, box);
      }
      case 'Activate':
        this.host.active = ws.name;
        return null;
      case 'Delete':
        // Excel keeps at least one sheet (from memory: a workbook must contain at least one visible worksheet).
        if (this.host.sheets.length === 1) throw new HostError('InvalidOperation', 'a workbook must keep one worksheet');
        this.host.sheets.splice(this.host.sheets.indexOf(ws), 1);
        if (this.host.active === ws.name) this.host.active = this.host.sheets[0]?.name ?? '';
        return null;
      default:
        return super.call(name, args);
    }
  }
}

class RangeNode extends SheetBound {
  readonly kind = 'Range';
  protected override readonly scalars = ['Address', 'Values', 'Formulas', 'NumberFormat', 'RowCount', 'ColumnCount'];
  constructor(
    host: ExcelHost,
    ws: HostSheet,
    readonly box: Box,
  ) {
    super(host, ws);
  }
  qualified(): string {
    return `${sheetPrefix(this.live().name)}!${a1(this.box)}`;
  }
  private grid<V>(f: (c: HostCell | undefined) => V): V[][] {
    const ws = this.live();
    const out: V[][] = [];
    for (let r = this.box.top; r <= this.box.bottom; r++) {
      const row: V[] = [];
      for (let c = this.box.left; c <= this.box.right; c++) row.push(f(ws.cells.get(key(r, c))));
      out.push(row);
    }
    return out;
  }
  override read(name: string): unknown {
    switch (name) {
      case 'Address':
        return this.qualified();
      case 'Values':
        return this.grid((c) => (c ? this.host.valueOf(c) : ''));
      case 'Formulas':
        return this.grid((c) =>
          c === undefined ? '' : typeof c.formula === 'string' && c.formula.startsWith("'") ? c.formula.slice(1) : c.formula,
        );
      case 'NumberFormat':
        return this.grid((c) => c?.format ?? 'General');
      case 'RowCount':
        return this.box.bottom - this.box.top + 1;
      case 'ColumnCount':
        return this.box.right - this.box.left + 1;
      default:
        return super.read(name);
    }
  }
  /** Each cell of a matrix the size of the range, or of a single value (Excel applies it to every cell). */
  private each(m: unknown, f: (cell: HostCell | undefined, v: unknown, k: string) => HostCell | undefined): void {
    const rows = this.box.bottom - this.box.top + 1;
    const cols = this.box.right - this.box.left + 1;
    const isMatrix = Array.isArray(m);
    if (isMatrix && (m.length !== rows || m.some((row) => !Array.isArray(row) || row.length !== cols)))
      throw new HostError('InvalidArgument', `The number of rows or columns in the input array doesn't match the size of ${a1(this.box)}`);
    const ws = this.live();
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const k = key(this.box.top + r, this.box.left + c);
        const v: unknown = isMatrix ? (m[r] as unknown[])[c] : m;
        const next = f(ws.cells.get(k), v, k);
        if (next === undefined || (next.formula === '' && next.format === 'General')) ws.cells.delete(k);
        else ws.cells.set(k, next);
      }
    }
  }
  override assign(name: string, m: unknown): void {
    if (name === 'Formulas' || name === 'Values') {
      this.each(m, (cell, v) => {
        if (!['string', 'number', 'boolean'].includes(typeof v))
          throw new HostError('InvalidArgument', `a cell cannot hold ${JSON.stringify(v)}`);
        return { formula: entered(v as Value), format: cell?.format ?? 'General' };
      });
    } else if (name === 'NumberFormat') {
      this.each(m, (cell, v) => ({ formula: cell?.formula ?? '', format: String(v) }));
    } else super.assign(name, m);
  }
  override call(name: string, args: unknown[]): unknown {
    if (name !== 'Clear') return super.call(name, args);
    const applyTo = args[0] === undefined || args[0] === null ? 'All' : this.host.checkEnum('ClearApplyTo', args[0]);
    this.each(undefined, (cell) => {
      if (!cell) return undefined;
      if (applyTo === 'Contents') return { formula: '', format: cell.format };
      if (applyTo === 'Formats') return { formula: cell.formula, format: 'General' };
      return undefined;
    });
    return null;
  }
}

class ChartsNode extends SheetBound {
  readonly kind = 'ChartCollection';
  private find(name: unknown): HostChart | undefined {
    return this.live().charts.find((c) => c.name === name || c.id === name);
  }
  override call(name: string, args: unknown[]): unknown {
    switch (name) {
      case 'Add': {
        const type = this.host.checkEnum('ChartType', args[0]);
        const by = args[2] === undefined || args[2] === null ? 'Auto' : this.host.checkEnum('ChartSeriesBy', args[2]);
        return new ChartNode(this.host, this.live(), this.host.newChart(this.live(), type, args[1] as HostNode, by));
      }
      case 'GetCount':
        return this.live().charts.length;
      case 'GetItem':
      case 'GetItemOrNullObject': {
        const c = this.find(args[0]);
        if (c) return new ChartNode(this.host, this.ws, c);
        if (name === 'GetItem') throw new HostError('ItemNotFound', `The requested resource doesn't exist: chart '${String(args[0])}'`);
        return null;
      }
      default:
        return super.call(name, args);
    }
  }
  override item(args: unknown[]): HostNode | null {
    return this.call('GetItem', args) as HostNode;
  }
}

/** A chart and the parts of it the adapter reaches (title, series, axes, legend, line format). */
class ChartNode extends SheetBound {
  readonly kind = 'Chart';
  protected override readonly scalars = ['Name', 'Id'];
  constructor(
    host: ExcelHost,
    ws: HostSheet,
    readonly chart: HostChart,
  ) {
    super(host, ws);
  }
  private alive(): HostChart {
    if (!this.live().charts.includes(this.chart)) throw new HostError('ItemNotFound', `chart '${this.chart.name}' was deleted`);
    return this.chart;
  }
  override identity(): object {
    return { Id: this.alive().id };
  }
  override read(name: string): unknown {
    if (name === 'Name') return this.alive().name;
    if (name === 'Id') return this.alive().id;
    return super.read(name);
  }
  override assign(name: string, v: unknown): void {
    if (name === 'Name') this.alive().name = String(v);
    else super.assign(name, v);
  }
  override property(name: string): HostNode {
    const c = this.alive();
    switch (name) {
      case 'Title':
        return new Part(this.host, 'ChartTitle', { Text: (v) => (c.title = String(v)) });
      case 'Legend':
        return new Part(this.host, 'ChartLegend', { Position: (v) => (c.legend = this.host.checkEnum('ChartLegendPosition', v)) });
      case 'Series':
        return new SeriesCollectionNode(this.host, this.ws, c);
      case 'Axes':
        return new Part(this.host, 'ChartAxes', {}, { ValueAxis: () => this.axis('value'), CategoryAxis: () => this.axis('category') });
      default:
        return super.property(name);
    }
  }
  private axis(which: 'value' | 'category'): HostNode {
    const c = this.chart;
    const title = (): HostNode =>
      new Part(this.host, 'ChartAxisTitle', {
        Text: (v) => (which === 'value' ? (c.valueAxis.title = String(v)) : (c.categoryAxis.title = String(v))),
      });
    if (which === 'category') return new Part(this.host, 'ChartAxis', {}, { Title: title });
    return new Part(
      this.host,
      'ChartAxis',
      {
        ScaleType: (v) => (c.valueAxis.scaleType = this.host.checkEnum('ChartAxisScaleType', v)),
        LogBase: (v) => {
          // Microsoft Learn, "Excel.ChartAxis class", logBase: from 2 to 1000.
          if (typeof v !== 'number' || v < 2 || v > 1000)
            throw new HostError('InvalidArgument', `logBase ${String(v)} is outside 2 to 1000`);
          c.valueAxis.logBase = v;
        },
        Minimum: (v) => {
          if (typeof v !== 'number') throw new HostError('InvalidArgument', `minimum must be a number, not ${JSON.stringify(v)}`);
          c.valueAxis.minimum = v;
        },
      },
      { Title: title },
    );
  }
  override call(name: string, args: unknown[]): unknown {
    const c = this.alive();
    if (name === 'SetPosition') {
      const cellOf = (v: unknown): string => (v instanceof RangeNode ? a1(v.box) : a1(parseBox(String(v))));
      c.position = [cellOf(args[0]), args[1] === undefined || args[1] === null ? cellOf(args[0]) : cellOf(args[1])];
      return null;
    }
    if (name === 'Delete') {
      this.live().charts.splice(this.live().charts.indexOf(c), 1);
      return null;
    }
    return super.call(name, args);
  }
}

class SeriesCollectionNode extends SheetBound {
  readonly kind = 'ChartSeriesCollection';
  constructor(
    host: ExcelHost,
    ws: HostSheet,
    private readonly chart: HostChart,
  ) {
    super(host, ws);
  }
  override call(name: string, args: unknown[]): unknown {
    if (name === 'GetItemAt') {
      const s = this.chart.series[Number(args[0])];
      if (!s) throw new HostError('ItemNotFound', `no series at index ${String(args[0])}`);
      return seriesNode(this.host, s);
    }
    if (name === 'Add') {
      const s: HostSeries = {
        name: typeof args[0] === 'string' ? args[0] : `Series${this.chart.series.length + 1}`,
        x: null,
        y: null,
        lineStyle: 'Continuous',
        markerStyle: 'Automatic',
      };
      this.chart.series.push(s);
      return seriesNode(this.host, s);
    }
    if (name === 'GetCount') return this.chart.series.length;
    return super.call(name, args);
  }
}

function seriesNode(host: ExcelHost, s: HostSeries): HostNode {
  const rangeArg = (v: unknown): string => {
    if (!(v instanceof RangeNode)) throw new HostError('InvalidArgument', 'a series takes its data from a range');
    return v.qualified();
  };
  const line = (): HostNode => new Part(host, 'ChartLineFormat', { LineStyle: (v) => (s.lineStyle = host.checkEnum('ChartLineStyle', v)) });
  return new Part(
    host,
    'ChartSeries',
    { Name: (v) => (s.name = String(v)), MarkerStyle: (v) => (s.markerStyle = host.checkEnum('ChartMarkerStyle', v)) },
    { Format: () => new Part(host, 'ChartSeriesFormat', {}, { Line: line }) },
    { SetXAxisValues: (a) => (s.x = rangeArg(a[0])), SetValues: (a) => (s.y = rangeArg(a[0])) },
  );
}

/** A small chart part: settable scalars, navigation properties and methods given as tables. */
class Part extends HostNode {
  constructor(
    host: ExcelHost,
    readonly kind: string,
    private readonly setters: Record<string, (v: unknown) => unknown>,
    private readonly children: Record<string, () => HostNode> = {},
    private readonly methods: Record<string, (args: unknown[]) => unknown> = {},
  ) {
    super(host);
  }
  override assign(name: string, v: unknown): void {
    const set = this.setters[name];
    if (set) set(v);
    else super.assign(name, v);
  }
  override property(name: string): HostNode {
    const child = this.children[name];
    return child ? child() : super.property(name);
  }
  override call(name: string, args: unknown[]): unknown {
    const m = this.methods[name];
    if (!m) return super.call(name, args);
    m(args);
    return null;
  }
}
