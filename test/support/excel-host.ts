/**
 * The host side of Office.js for tests: an in-memory workbook that answers the JSON requests Microsoft's
 * Excel client (test/support/office-js.ts) sends on context.sync(), so that everything above the transport
 * is the real client. The session handed to Excel.run uses the client's own SessionBase hooks: it names the
 * request executor (ours) and the event registration (ours). The objects the host models are in
 * excel-host-sheet.ts and excel-host-chart.ts.
 *
 * The wire format is the one the client builds (ClientRequest.buildRequestMessageBodyAndRequestFlags in
 * @microsoft/office-js 1.1.110): a body of ObjectPaths (id -> GlobalObject 1, Method 3, Property 4,
 * Indexer 5, ReferenceId 6, NullObject 7, each with its parent and arguments) and Actions (Instantiate 1,
 * Query 2, Method 3, SetProperty 4, Trace 5) run in order; the answer is { Results: [{ ActionId, Value }],
 * TraceIds, Error: { Code, Message, Location, ActionIndex } }, with PascalCase property names and
 * collections as { _Items: [...] } (what the client's _handleResult reads). An object the client keeps
 * with _KeepReference is answered with a _ReferenceId, which later requests use as a path (type 6) and
 * Excel.run releases with _RemoveReference when it ends; without this the client refuses to reuse a range
 * after a sync. The host runs actions until one fails: what ran before stays and the rest does not run
 * (Excel's behaviour from memory). Members the adapter does not use are refused loudly (NotImplemented), so
 * a new call in the adapter fails here until it is modelled.
 */
import { excelApiSets, newerThan } from './excel-api-sets.js';
import { ChartsNode } from './excel-host-chart.js';
import {
  HostError,
  HostNode,
  WorkbookNode,
  entered,
  key,
  parseBox,
  type Box,
  type HostCell,
  type HostSheet,
  type Value,
} from './excel-host-sheet.js';
import type { OfficeJs } from './office-js.js';

export { HostError, type HostCell, type HostChart, type HostSeries, type HostSheet, type Value } from './excel-host-sheet.js';

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

  /** A fresh number for ids and names. */
  newId(): number {
    return this.nextId++;
  }

  /** The chart collection of a sheet (its classes live in excel-host-chart.ts). */
  chartsOf(ws: HostSheet): HostNode {
    return new ChartsNode(this, ws);
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
