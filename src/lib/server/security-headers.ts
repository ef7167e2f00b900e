// Headers every server-rendered answer carries. The CSP allows only our own origin: fonts,
// scripts and styles are shipped with the app; photos may be blob: or data: URLs on the device.
export function securityHeaders(url: URL): Record<string, string> {
  const headers: Record<string, string> = {
    'x-content-type-options': 'nosniff',
    'x-frame-options': 'DENY',
    'referrer-policy': 'same-origin',
    'permissions-policy': 'camera=(self), geolocation=(), microphone=()',
    'content-security-policy': [
      "default-src 'self'",
      "script-src 'self' 'unsafe-inline'",
      "style-src 'self' 'unsafe-inline'",
      "img-src 'self' blob: data:",
      "font-src 'self'",
      "connect-src 'self'",
      "worker-src 'self'",
      "manifest-src 'self'",
      "frame-ancestors 'none'",
      "base-uri 'self'",
      "form-action 'self'",
      "object-src 'none'",
    ].join('; '),
  };
  if (url.protocol === 'https:') headers['strict-transport-security'] = 'max-age=31536000; includeSubDomains';
  return headers;
}
