/** The fictional demo organisation and its four people, one role each. */
import type { Role } from '../constants/schemas/roles';

export const DEMO_ORGANISATION = { name: 'Halden Ridge Instruments', slug: 'halden-ridge' };

export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@fieldfile.test', name: 'Mira Okafor', role: 'admin' },
  { email: 'specialist@fieldfile.test', name: 'Tomas Lindqvist', role: 'specialist' },
  { email: 'engineer@fieldfile.test', name: 'Priya Raman', role: 'engineer' },
  { email: 'approver@fieldfile.test', name: 'Jonas Weber', role: 'approver' },
];
