import type { Role } from '@femtoslot/shared';
import { paths } from './paths';

/**
 * The one place that says which role reaches which area. The router guards and the
 * navigation both read it; browser tests may import it too (it has no DOM dependencies).
 */
export const areas = ['calendar', 'sessions', 'billing', 'reports', 'settings', 'people', 'sources', 'beam-time', 'training'] as const;
export type Area = (typeof areas)[number];

export interface NavigationArea {
  area: Area;
  label: string;
  path: string;
  roles: readonly Role[];
  /** data-testid on the nav link */
  testId: `nav-${Area}`;
}

export const navigationAreas: readonly NavigationArea[] = [
  {
    area: 'calendar',
    label: 'Calendar',
    path: paths.calendar,
    roles: ['collaborator', 'member', 'pi', 'staff', 'finance', 'admin'],
    testId: 'nav-calendar',
  },
  {
    area: 'sessions',
    label: 'Session log',
    path: paths.sessions,
    roles: ['collaborator', 'member', 'pi', 'staff'],
    testId: 'nav-sessions',
  },
  {
    area: 'billing',
    label: 'Billing',
    path: paths.billing,
    roles: ['collaborator', 'pi', 'finance', 'admin'],
    testId: 'nav-billing',
  },
  {
    area: 'reports',
    label: 'Reports',
    path: paths.reports,
    roles: ['pi', 'staff', 'finance'],
    testId: 'nav-reports',
  },
  {
    area: 'settings',
    label: 'Settings',
    path: paths.settings,
    roles: ['staff', 'admin'],
    testId: 'nav-settings',
  },
  {
    area: 'people',
    label: 'People',
    path: paths.people,
    roles: ['admin'],
    testId: 'nav-people',
  },
  {
    area: 'sources',
    label: 'Sources & stations',
    path: paths.sources,
    roles: ['staff', 'admin'],
    testId: 'nav-sources',
  },
  {
    area: 'beam-time',
    label: 'My beam time',
    path: paths.myBeamTime,
    roles: ['collaborator', 'member', 'pi', 'staff', 'finance', 'admin'],
    testId: 'nav-beam-time',
  },
  {
    area: 'training',
    label: 'Training',
    path: paths.training,
    roles: ['collaborator', 'member', 'pi', 'staff', 'finance', 'admin'],
    testId: 'nav-training',
  },
];

export const areaRoles: Readonly<Record<Area, readonly Role[]>> = Object.fromEntries(
  navigationAreas.map((entry) => [entry.area, entry.roles]),
) as Record<Area, readonly Role[]>;

export function canReach(role: Role, area: Area): boolean {
  return areaRoles[area].includes(role);
}

export function navigationFor(role: Role): NavigationArea[] {
  return navigationAreas.filter((entry) => entry.roles.includes(role));
}
