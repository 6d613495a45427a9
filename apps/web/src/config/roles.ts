import type { Role } from '@femtoslot/shared';

export const roleLabels: Readonly<Record<Role, string>> = {
  collaborator: 'External collaborator',
  member: 'Group member',
  pi: 'Group leader (PI)',
  staff: 'Facility scientist',
  finance: 'Finance',
  admin: 'Administrator',
};
