export const INLINE_SCRIPT_HASHES: string[];
export function contentSecurityPolicy(options?: { forMeta?: boolean; dev?: boolean }): string;
export function securityHeaders(options?: { tls?: boolean; dev?: boolean }): Record<string, string>;
export function lastHeaderValue(value: string | null | undefined): string | undefined;
export function servedOverTls(forwardedProto: string | null | undefined, env?: Record<string, string | undefined>): boolean;
