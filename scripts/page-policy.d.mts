/** Types for scripts/page-policy.mjs (used by the build, the servers, the deploy command and the tests). */
export declare const OFFICE_JS_URL: string;
export declare const OFFICE_JS_CDN: readonly string[];
export declare const MICROSOFT_AJAX_HOST: string;
export declare const OFFICE_JS_HOSTS: readonly string[];
export declare const CONTENT_SECURITY_POLICY: string;
export declare function withPolicy(html: string, name?: string): string;
export declare function loadsOfficeJsFirst(html: string): boolean;
export declare function previewPage(html: string, name?: string): string;
