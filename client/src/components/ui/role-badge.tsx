import type { Role } from '@client/features/session/lib/roles';
import { ROLE_LABEL } from '@client/features/session/lib/roles';

// Outlined badges: text and border share one colour on the page background
// (contrast figures in styles.css). Admin is the only filled badge.
const roleClasses: Record<Role, string> = {
  admin: 'bg-ink text-paper border-ink',
  lecturer: 'text-reference border-reference',
  assistant: 'text-bonding border-bonding',
  student: 'text-student border-student',
};

export function RoleBadge({ role }: { role: Role }) {
  return (
    <span
      className={`inline-flex items-center rounded-[2px] border px-1.5 py-px text-[0.75rem] leading-4 font-semibold tracking-[0.04em] uppercase ${roleClasses[role]}`}
      data-role={role}
    >
      {ROLE_LABEL[role]}
    </span>
  );
}
