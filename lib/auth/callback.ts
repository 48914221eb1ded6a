// Where to send a member after signing in. Only a path on our own site is followed: the address is
// read as a browser reads it (backslashes as slashes, tabs and newlines dropped) against our origin,
// and anything that would leave it — `//host`, `/\host`, `/\t/host`, `https://host` — goes home.
const OWN_ORIGIN = 'http://kettlefork.invalid';

export function safeCallbackPath(raw: string | null | undefined): string {
  if (!raw) return '/';
  let url: URL;
  try {
    url = new URL(raw, OWN_ORIGIN);
  } catch {
    return '/';
  }
  if (url.origin !== OWN_ORIGIN) return '/';
  const path = `${url.pathname}${url.search}${url.hash}`;
  // A path that itself starts with two slashes would be read as another host when followed.
  return /^\/[/\\]/.test(path) ? '/' : path;
}
