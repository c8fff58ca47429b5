/** Types for scripts/serve.mjs (used by the tests). */
import type { IncomingMessage, Server, ServerResponse } from 'node:http';

export declare const OFFICE_JS_HOSTS: readonly string[];
export declare const CONTENT_SECURITY_POLICY: string;
export declare function securityHeaders(): Record<string, string>;
export declare function createHandler(root: string, index?: string): (req: IncomingMessage, res: ServerResponse) => void;
export interface ServeOptions {
  root: string;
  host: string;
  port: number;
  http: boolean;
  cert: string | undefined;
  key: string | undefined;
  /** The page / redirects to (default taskpane.html). */
  index?: string;
}
export declare function parseArgs(argv: readonly string[]): ServeOptions;
export declare function startServer(options: ServeOptions): Promise<{ server: Server; url: string }>;
