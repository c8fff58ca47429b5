export interface Preview {
  readonly url: string;
  readonly port: number;
  close(): Promise<void>;
}
export function startPreview(options?: { root?: string; port?: number; host?: string }): Promise<Preview>;
export const PREVIEW_CONTENT_SECURITY_POLICY: string;
export const PREVIEW_PAGE: string;
