/**
 * The one piece of Excel the real-runtime suite stands in for: the native message channel below Office's
 * custom-functions runtime. Runs in the page before any script (Playwright's addInitScript), so it is
 * self-contained: no imports, no closures over Node values.
 *
 * What it replaces. Office's runtime (`Core.HostBridge` in custom-functions-runtime.debug.js of
 * @microsoft/office-js 1.1.110) talks to a native host through a global `_richApiNativeBridge` object
 * when one exists at load: it sets `onMessageFromHost(text)` on it and calls `sendMessageToHost(text)`.
 * Excel's desktop hosts provide that object; here it is this stub, which does only two things:
 *  - `deliver(entries)` hands invocation entries to the runtime exactly where the host would, as one JSON
 *    message of type 3 (`{ type: 3, message: { entries } }`); the runtime's `CustomFunctionProxy` takes it
 *    from there (`_handleMessage` -> `_batchInvocationEntries` -> the associated function);
 *  - it records every request the runtime sends (the rich-API `ProcessQuery` that carries
 *    `SetInvocationArrayResults`) and answers each with HTTP 200 and no action results, as a host does
 *    for a call that returns nothing.
 * What it therefore cannot show: what Excel puts into the entries (it is told, see harness.ts), what Excel
 * does with the results afterwards (cell display, spill placement, the error flyout), Excel's own failure
 * answers to a request, and the start-up handshake (`CustomFunctions.initialize`, which runs only after
 * Office.onReady reports Excel, never in a plain browser).
 */

/** One result the runtime handed back, as it sent it: the action's name and one entry of its argument. */
export interface SentResult {
  readonly action: string;
  readonly entry: unknown;
}

/** What the page exposes to the harness as `window.__realRuntimeBridge`. */
export interface BridgeHandle {
  deliver(entries: unknown[]): void;
  readonly results: SentResult[];
  readonly requests: number;
  readonly otherActions: string[];
}

/** Installs the stub as `window._richApiNativeBridge` and the harness's handle as `window.__realRuntimeBridge`. */
export function installNativeBridge(): void {
  // The runtime's names of the result actions (CustomFunctions.prototype.setInvocationArrayResults and
  // setInvocationResults, _SetInvocationResult and _SetInvocationError in the same file).
  const RESULT_ACTIONS = ['SetInvocationArrayResults', 'SetInvocationResults', '_SetInvocationResult', '_SetInvocationError'];
  const results: SentResult[] = [];
  const otherActions: string[] = [];
  let requests = 0;
  const bridge: { sendMessageToHost(text: string): void; onMessageFromHost?: (text: string) => void } = {
    sendMessageToHost(text: string) {
      const message = JSON.parse(text) as {
        id: number;
        type: number;
        message?: { body?: { Actions?: { Name?: string; ArgumentInfo?: { Arguments?: unknown[] } }[] } };
      };
      requests++;
      for (const action of message.message?.body?.Actions ?? []) {
        const name = action.Name ?? '';
        const args = action.ArgumentInfo?.Arguments ?? [];
        if (name === 'SetInvocationArrayResults' || name === 'SetInvocationResults') {
          for (const entry of (args[0] as unknown[] | undefined) ?? []) results.push({ action: name, entry });
        } else if (RESULT_ACTIONS.includes(name)) results.push({ action: name, entry: args });
        else if (name !== '') otherActions.push(name);
      }
      const answer = { id: message.id, type: message.type, message: { statusCode: 200, headers: {}, body: { Results: [] } } };
      // Asynchronously, as a host answers: the runtime's promise for this request is registered after the send.
      setTimeout(() => bridge.onMessageFromHost?.(JSON.stringify(answer)), 0);
    },
  };
  const handle: BridgeHandle = {
    deliver(entries: unknown[]) {
      if (!bridge.onMessageFromHost) throw new Error('the custom-functions runtime did not attach to the native bridge');
      bridge.onMessageFromHost(JSON.stringify({ type: 3, message: { entries } }));
    },
    results,
    get requests() {
      return requests;
    },
    otherActions,
  };
  const w = window as unknown as Record<string, unknown>;
  w['_richApiNativeBridge'] = bridge;
  w['__realRuntimeBridge'] = handle;
}
