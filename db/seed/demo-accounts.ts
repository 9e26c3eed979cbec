/** The demo organisations and one user per role (all invented; .example addresses never deliver). */
export const DEMO_PASSWORD = 'port-ellery-demo';

export const DEMO_FIRM = 'Lantern Valuation Group';
export const DEMO_LENDER = 'Harbourside Mutual';

export const demoOrganisations = [
  { name: DEMO_FIRM, kind: 'firm' as const },
  { name: DEMO_LENDER, kind: 'lender' as const },
];

export const demoUsers = [
  { email: 'appraiser@lantern-valuation.example', name: 'Maren Holt', role: 'appraiser' as const, organisation: DEMO_FIRM, licenceNumber: 'PE-CR-04417' },
  { email: 'reviewer@lantern-valuation.example', name: 'Tobias Quill', role: 'reviewer' as const, organisation: DEMO_FIRM, licenceNumber: 'PE-CG-01290' },
  { email: 'admin@lantern-valuation.example', name: 'Ruth Calloway', role: 'admin' as const, organisation: DEMO_FIRM, licenceNumber: null },
  { email: 'client@harbourside-mutual.example', name: 'Ines Farrow', role: 'client' as const, organisation: DEMO_LENDER, licenceNumber: null },
];
