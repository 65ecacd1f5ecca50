/**
 * The people of the demo: Aldermere University, Department of Chemistry — a
 * fictional university. Every name is invented; e-mail addresses use the
 * reserved example domain so that nothing can reach a real person.
 */
export interface DemoPerson {
  login: string;
  givenName: string;
  familyName: string;
  email: string;
  hint?: string;
}

export const DEMO_DOMAIN = 'aldermere.example';

const person = (login: string, givenName: string, familyName: string, hint?: string): DemoPerson => ({
  login,
  givenName,
  familyName,
  email: `${login}@${DEMO_DOMAIN}`,
  hint,
});

/** One account per role, shown as one-click buttons on the stand-in's sign-in page. */
export const demoRoleAccounts: DemoPerson[] = [
  person('admin', 'Imogen', 'Thale', 'department admin'),
  person('lecturer', 'Marguerite', 'Vance', 'lecturer'),
  person('assistant', 'Tobias', 'Renn', 'teaching assistant'),
  person('student', 'Priya', 'Aldana', 'student'),
];

export const demoOtherStaff: DemoPerson[] = [
  person('h.solvang', 'Henrik', 'Solvang', 'lecturer'),
  person('a.boateng', 'Ama', 'Boateng', 'teaching assistant'),
  person('l.ferrante', 'Luca', 'Ferrante', 'teaching assistant'),
];

const GIVEN = ['Aino', 'Bastian', 'Chiara', 'Dmitri', 'Elif', 'Farid', 'Greta', 'Hamza', 'Ines', 'Jonas', 'Keiko', 'Lars', 'Mireille', 'Nikhil', 'Oona', 'Pavel', 'Quinn', 'Rosa', 'Soren', 'Talia', 'Umar', 'Vera', 'Wen', 'Ximena', 'Yusuf', 'Zofia', 'Anouk', 'Benedikt', 'Cosima', 'Dario'];
const FAMILY = ['Ashcombe', 'Brannigan', 'Castellane', 'Dervish', 'Elmsworth', 'Fairleigh', 'Gundersen', 'Halloway', 'Ibarra', 'Jessop', 'Kowalczyk', 'Lindqvist', 'Marchetti', 'Nakagawa', 'Oyelaran', 'Pemberton', 'Quaresma', 'Rasmussen', 'Szabo', 'Tremaine', 'Ulloa', 'Varga', 'Whitcombe', 'Xu', 'Yilmaz', 'Zeller', 'Abernethy', 'Bouchard', 'Cardenas', 'Delacroix'];

/** 60 invented students (plus the demo student), deterministic. */
export const demoStudents: DemoPerson[] = Array.from({ length: 60 }, (_, i) => {
  const given = GIVEN[(i * 7) % GIVEN.length];
  const family = FAMILY[(i * 11 + 3) % FAMILY.length];
  const login = `s${String(2400101 + i)}`;
  return person(login, given, family);
});

export const allDemoPeople: DemoPerson[] = [...demoRoleAccounts, ...demoOtherStaff, ...demoStudents];
