/**
 * True for a path of this app that is safe to send a browser to after signing in: it starts with
 * one slash, and nothing a browser would read as another host (`//host`, `/\host`) or a control
 * character slips in.
 */
export function isSafeLocalPath(value: string | null | undefined): value is string {
  if (!value || !value.startsWith('/')) return false;
  if (value.startsWith('//') || value.includes('\\')) return false;
  return !/[\u0000-\u001f\u007f]/.test(value);
}
