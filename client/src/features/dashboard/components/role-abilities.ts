import type { Role } from '@client/features/session/lib/roles';

export interface Ability {
  text: string;
  /** A page of the app where this is done, once that page exists. */
  to?: string;
}

/** What each role does in Bondmark (product design, "People and roles"). */
export const ROLE_ABILITIES: Record<Role, { heading: string; abilities: Ability[] }> = {
  admin: {
    heading: 'As department admin',
    abilities: [
      { text: 'Manage people and their roles', to: '/admin/people' },
      { text: 'See every course of every term', to: '/courses' },
      { text: 'Export marks for the registrar' },
      { text: 'Read the record of every change', to: '/admin/audit' },
    ],
  },
  lecturer: {
    heading: 'As lecturer',
    abilities: [
      { text: 'Build courses, lab sections and rosters', to: '/courses' },
      { text: 'Author exercises and their marking schemes' },
      { text: 'Publish exercises and extend deadlines' },
      { text: 'Moderate marks across assistants' },
    ],
  },
  assistant: {
    heading: 'As assistant',
    abilities: [
      { text: 'Mark reports in the marking table' },
      { text: 'Adjust a mark, giving a reason' },
      { text: 'Write feedback and return reports' },
    ],
  },
  student: {
    heading: 'As student',
    abilities: [
      { text: 'Download your personal template' },
      { text: 'Upload your report; new versions never replace old ones' },
      { text: 'Read your feedback once it is returned' },
    ],
  },
};
