import { defaultSignedInPath, paths } from '../../../config/paths';

const publicPaths: string[] = [paths.signIn, paths.forgotPassword, paths.resetPassword, paths.acceptInvitation];

/** Only same-origin app paths are followed after sign-in; anything else lands on the calendar. */
export function safeRedirect(from: unknown): string {
  if (typeof from !== 'string' || !from.startsWith('/') || from.startsWith('//') || from.startsWith('/\\')) {
    return defaultSignedInPath;
  }
  const pathname = from.split(/[?#]/)[0];
  if (publicPaths.includes(pathname) || pathname === paths.home) return defaultSignedInPath;
  return from;
}
