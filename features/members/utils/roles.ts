import type { Role } from '@/lib/domain';

/** The roles in the order the pickers list them, with what each may do in a few words. */
export const ROLE_CHOICES = [
  {
    value: 'designer',
    label: 'Designer',
    does: 'creates sites and boards, sizes, sends for review',
  },
  { value: 'inspector', label: 'Inspector', does: 'reviews and issues boards, walks the labels' },
  { value: 'installer', label: 'Installer', does: 'prints issued schedules, walks the labels' },
  { value: 'admin', label: 'Admin', does: 'everything, including members' },
] as const satisfies readonly { value: Role; label: string; does: string }[];

/** A role's name as the screens show it. */
export function roleLabel(role: Role): string {
  return ROLE_CHOICES.find((r) => r.value === role)?.label ?? role;
}
