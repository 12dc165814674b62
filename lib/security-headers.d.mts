export function storageOrigins(env?: Record<string, string | undefined>): string[];
export function contentSecurityPolicy(options?: { nonce?: string; env?: Record<string, string | undefined>; dev?: boolean }): string;
export const API_CONTENT_SECURITY_POLICY: string;
export function securityHeaders(env?: Record<string, string | undefined>): { key: string; value: string }[];
