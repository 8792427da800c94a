export const roles = ['rider', 'staff', 'warehouse', 'admin'] as const;
export type Role = (typeof roles)[number];

/** Which areas each role may use; staff areas are open to admins too. */
export const areaRoles = {
  shop: roles,
  account: roles,
  staff: ['staff', 'admin'],
  warehouse: ['warehouse', 'admin'],
  admin: ['admin'],
} as const satisfies Record<string, readonly Role[]>;
export type Area = keyof typeof areaRoles;

/**
 * Tells whether a role may use an area.
 * @example mayUse('rider', 'staff') // false
 */
export function mayUse(role: Role | undefined, area: Area): boolean {
  return role !== undefined && (areaRoles[area] as readonly Role[]).includes(role);
}

export interface UserDto {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  disabled: boolean;
  createdAt: string;
}

export interface SessionDto {
  user: UserDto;
  token: string;
  expiresAt: string;
}
