// better-auth decides once, from PUBLIC_BASE_URL, whether its cookies are Secure. Behind a proxy
// that ends TLS the base URL may still say http://, so a request that did come over TLS gets
// every cookie marked Secure here: a session cookie must never travel back over plain HTTP.
export function withSecureCookies(response: Response): Response {
  const cookies = response.headers.getSetCookie();
  if (cookies.length === 0 || cookies.every(isSecure)) return response;
  const headers = new Headers(response.headers);
  headers.delete('set-cookie');
  for (const cookie of cookies) headers.append('set-cookie', isSecure(cookie) ? cookie : `${cookie}; Secure`);
  return new Response(response.body, { status: response.status, statusText: response.statusText, headers });
}

function isSecure(cookie: string): boolean {
  return cookie.split(';').slice(1).some((attribute) => attribute.trim().toLowerCase() === 'secure');
}
