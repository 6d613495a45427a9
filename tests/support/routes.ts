const fakeId = '00000000-0000-4000-8000-000000000000';

/** A callable URL for a router-table path: every :param becomes a well-formed id that matches no row. */
export const concretePath = (path: string) => `/api${path.replace(/:file\b/, 'x.ics').replace(/:token\b/, 'x'.repeat(24)).replace(/:[a-zA-Z]+/g, fakeId)}`;
