/**
 * Where to go after signing in: the asked-for path when it is one of this site's own, else '/'.
 * A path must start with a single '/': '//host' and '/\host' are addresses of another site to a
 * browser (protocol-relative), and control characters or a scheme never belong in one.
 */
export function safeRedirectPath(asked: unknown): string {
  if (typeof asked !== 'string' || asked.length > 2000) return '/'
  if (!asked.startsWith('/') || /^\/[/\\]/.test(asked)) return '/'
  // eslint-disable-next-line no-control-regex -- control characters are what is refused here
  if (/[\u0000-\u001f\u007f\\]/.test(asked)) return '/'
  return asked
}
