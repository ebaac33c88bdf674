// Where the API lives. In development Expo's dev server and the API run on different ports, so
// EXPO_PUBLIC_API_URL names the API's origin; in production the web build is served by the API itself.

/** The API origin without a trailing slash; '' when it cannot be known (Node without the variable). */
export function resolveApiBaseUrl(): string {
  // Written out in full so that Expo inlines the variable into the web bundle.
  const fromEnv = process.env.EXPO_PUBLIC_API_URL;
  if (fromEnv) return fromEnv.replace(/\/+$/, '');
  if (typeof window !== 'undefined' && window.location?.origin) return window.location.origin;
  return '';
}

/** The origin the web app itself is served from (where e-mailed links must point). */
export function resolveAppOrigin(): string {
  if (typeof window !== 'undefined' && window.location?.origin) return window.location.origin;
  return resolveApiBaseUrl();
}
