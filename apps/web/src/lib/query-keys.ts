/** Every query key in the web app comes from one of these factories. */
export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
  invitation: (token: string) => [...authKeys.all, 'invitation', token] as const,
};

export const facilityKeys = {
  all: ['facility'] as const,
  detail: () => [...facilityKeys.all, 'detail'] as const,
};

export const userKeys = {
  all: ['users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};

export const organisationKeys = {
  all: ['organisations'] as const,
  list: () => [...organisationKeys.all, 'list'] as const,
};
