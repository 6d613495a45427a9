export const paths = {
  home: '/',
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  acceptInvitation: '/accept-invitation',
  calendar: '/calendar',
  planDay: '/calendar/plan',
  sessions: '/sessions',
  sessionLog: '/sessions/:bookingId',
  billing: '/billing',
  reports: '/reports',
  settings: '/settings',
  people: '/people',
  sources: '/sources',
  myBeamTime: '/beam-time',
  training: '/training',
} as const;

export const sessionLogPath = (bookingId: string) => `/sessions/${encodeURIComponent(bookingId)}`;

/** Where a signed-in person lands when nothing else asked for a page. */
export const defaultSignedInPath = paths.calendar;
