// Types of security-headers.mjs (plain JS so next.config.mjs and the service worker build import it).
export declare const CONTRAST_SCRIPT: string;
export declare const STATIC_SCRIPT_HASHES_FILE: string;
export declare function scriptHash(text: string): string;
export declare function inlineScriptHashes(html: string): string[];
export declare function contentSecurityPolicy(options?: { storageOrigin?: string | null; dev?: boolean; nonce?: string; scriptHashes?: string[] }): string;
export declare function securityHeaders(): { source: string; has?: { type: string; key: string; value?: string }[]; headers: { key: string; value: string }[] }[];
export declare function storageOrigin(endpoint?: string): string | null;
