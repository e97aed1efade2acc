/** Turns next-auth's error code for a refused sign-in into a plain sentence. */
export function signInErrorMessage(code: string | undefined | null): string | null {
  if (!code) return null;
  const limited = /^limited:(\d+)$/.exec(code);
  if (limited) {
    const minutes = Math.max(1, Math.ceil(Number(limited[1]) / 60));
    return `Too many failed attempts. For your account's safety, signing in is paused for ${minutes} minute${minutes === 1 ? '' : 's'}. You can also ask for a new password.`;
  }
  if (code === 'CredentialsSignin') return 'That e-mail address and password do not match an active account.';
  if (code === 'SessionRequired') return 'Sign in to open that page.';
  return 'Signing in did not work just now. Try again in a moment.';
}
