import type { Role } from '../db/entities';

/**
 * The invented demo workspace and its people (Otterbay Parcel Co. is a fictional company;
 * otterbay.example is a reserved domain). Used by the seed and by the identity-provider fake.
 */
export const DEMO_WORKSPACE = { slug: 'otterbay', name: 'Otterbay Parcel Co.' } as const;

export interface DemoPerson {
  email: string;
  displayName: string;
  role: Role;
  /** What this person does at the invented company, shown on the identity-provider fake's page. */
  title: string;
}

export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { email: 'nadia.okafor@otterbay.example', displayName: 'Nadia Okafor', role: 'owner', title: 'Head of Platform' },
  { email: 'tomas.reyes@otterbay.example', displayName: 'Tomás Reyes', role: 'architect', title: 'Lead Architect, Dispatch' },
  { email: 'priya.raman@otterbay.example', displayName: 'Priya Raman', role: 'reviewer', title: 'Architecture Board' },
  { email: 'jonah.whitlock@otterbay.example', displayName: 'Jonah Whitlock', role: 'viewer', title: 'Test Lead' },
];
