// The pages' content security policy, with a fresh nonce per request.
// Next reads the nonce back from the request's Content-Security-Policy header and puts it on its
// own inline and bundle scripts (node_modules/next/dist/docs/01-app/02-guides/content-security-policy.md),
// so every page renders dynamically. API routes get a fixed, stricter policy from next.config.mjs.
import { NextResponse, type NextRequest } from 'next/server';

/** The page policy for one nonce (tests/integration/attacks.test.ts spells it out on its own). */
function pagePolicy(nonce: string, development = false): string {
  return [
    "default-src 'self'",
    // 'strict-dynamic': the nonced bootstrap may load the chunks it needs; host lists and inline
    // handlers are ignored. React's development build needs eval for its error stacks.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ''}`,
    // In development Next injects styles without the nonce (the guide above), so they go inline.
    `style-src 'self' ${development ? "'unsafe-inline'" : `'nonce-${nonce}'`}`,
    // Bars and swatches carry their width or colour in a style attribute (React escapes the value);
    // a <style> element still needs the nonce.
    "style-src-attr 'unsafe-inline'",
    "img-src 'self'",
    "font-src 'self'",
    "connect-src 'self'",
    "worker-src 'self'",
    "object-src 'none'",
    "frame-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

export function proxy(request: NextRequest) {
  const nonce = btoa(String.fromCharCode(...crypto.getRandomValues(new Uint8Array(18))));
  const policy = pagePolicy(nonce, process.env.NODE_ENV === 'development');
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('content-security-policy', policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('content-security-policy', policy);
  return response;
}

export const config = {
  matcher: [
    {
      // Not the API (its upload routes stream bodies the proxy would cut at 10 MB; see DEVELOPERS.md),
      // nor build assets, nor link prefetches (data, not documents).
      source: '/((?!api/|_next/static/|_next/image|favicon.ico).*)',
      missing: [
        { type: 'header', key: 'next-router-prefetch' },
        { type: 'header', key: 'purpose', value: 'prefetch' },
      ],
    },
  ],
};
