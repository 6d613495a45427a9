export const paths = {
  home: '/',
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  acceptInvitation: '/accept-invitation',
  calendar: '/calendar',
  planDay: '/calendar/plan',
  sessions: '/sessions',
  billing: '/billing',
  reports: '/reports',
  settings: '/settings',
  people: '/people',
} as const;

/** Where a signed-in person lands when nothing else asked for a page. */
export const defaultSignedInPath = paths.calendar;
