import { cleanSaleRows, csvFile, mappingFor, standardHeaders } from '../factories/csv';
import { plainJpeg } from '../factories/images';
import type { ApiRoute } from './route-table';
import type { Agent } from './test-api';

/** One well-formed request per write route: what a form of the app would send. The access matrix
 * sends these where a bad body would stop a request before the record is looked up (so that a
 * refusal means "not yours", not "malformed"), and the input fuzz mutates them. Every write route
 * must have one: a new route without a sample fails both tests until it gets one. */

export interface SampleRequest {
  body?: Record<string, unknown>;
  query?: Record<string, string>;
  /** Multipart upload instead of a JSON body. */
  files?: Array<{ field: string; bytes: Buffer; name: string }>;
  fields?: Record<string, string>;
}

const sale = {
  address: '41 Ropewalk Lane',
  salePrice: 352_000,
  saleDate: '2026-04-09',
  floorArea: 1_480,
  bedrooms: 3,
  bathrooms: 1.5,
  yearBuilt: 1961,
  saleType: 'arms_length',
  dataSource: 'Port Ellery deed record (invented)',
};

/** Samples keyed by route key ("POST /assignments/:id/sales"). `refs` fills the few ids a body
 * names (an organisation, a fee); a made-up id is fine where only the shape matters. */
export async function sampleRequests(refs: { organisationId: number; feeId: number } = { organisationId: 1, feeId: 1 }): Promise<Record<string, SampleRequest>> {
  const jpeg = await plainJpeg(64, 48, '#3f6e5a');
  const csv = csvFile(cleanSaleRows(2, 900));
  const mapping = JSON.stringify(mappingFor(standardHeaders));
  return {
    'POST /payments/webhook': { body: { id: 'evt_sample', type: 'payment_intent.succeeded' } },
    'POST /auth/sign-in': { body: { email: 'nobody@factory.example', password: 'not-a-real-password' } },
    'POST /auth/sign-out': { body: {} },
    'POST /auth/password-reset': { body: { email: 'nobody@factory.example' } },
    'POST /auth/password-reset/confirm': { body: { token: 'x'.repeat(43), password: 'a-long-new-password' } },
    'POST /invitations/accept': { body: { token: 'x'.repeat(43), password: 'a-long-new-password' } },
    'POST /users/invitations': { body: { email: 'invitee@factory.example', name: 'Invited Person', role: 'appraiser', organisationId: refs.organisationId } },
    'PATCH /users/:id': { body: { version: 1, active: true } },
    'POST /assignments': {
      body: { subjectAddress: '9 Chandlery Walk, Port Ellery', intendedUse: 'Mortgage lending decision', clientOrganisationId: refs.organisationId, effectiveDate: '2026-11-15' },
    },
    'PATCH /assignments/:id': { body: { version: 1, loanReference: 'HM-SAMPLE-1' } },
    'PUT /assignments/:id/subject': { body: { version: 1, floorArea: 1_650, bedrooms: 3 } },
    'POST /assignments/:id/sales': { body: sale },
    'PATCH /assignments/:id/sales/:saleId': { body: { version: 1, verificationNote: 'Confirmed with the listing agent.' } },
    'DELETE /assignments/:id/sales/:saleId': { query: { version: '1' } },
    'POST /assignments/:id/sales/import/preview': { files: [{ field: 'file', bytes: csv, name: 'sales.csv' }] },
    'POST /assignments/:id/sales/import': { files: [{ field: 'file', bytes: csv, name: 'sales.csv' }], fields: { mapping } },
    'POST /assignments/:id/photos': { files: [{ field: 'files', bytes: jpeg, name: 'front.jpg' }] },
    'DELETE /photos/:id': {},
    'PUT /assignments/:id/grid/settings': { body: { version: 1, valueIncrement: 1_000 } },
    'PUT /assignments/:id/grid/sales/:saleId': { body: { version: 0, lineItems: [{ feature: 'garage', amount: -5_000, note: 'two-car garage' }], weightPct: null } },
    'PUT /firm-settings': { body: { version: 1, netLimitPct: 15 } },
    'POST /assignments/:id/transitions': { body: { action: 'submit', version: 1 } },
    'POST /assignments/:id/queries': { body: { saleId: null, body: 'Is the floor area verified?' } },
    'POST /queries/:id/messages': { body: { body: 'The assessor’s card agrees.' } },
    'POST /queries/:id/answer': { body: { action: 'keep', explanation: 'Verified against the builder’s plans.', version: 1 } },
    'POST /queries/:id/resolve': { body: { version: 1 } },
    'POST /queries/:id/reopen': { body: { version: 1, body: 'One more question.' } },
    'POST /orders': {
      body: { subjectAddress: '3 Chandlery Walk, Port Ellery', intendedUse: 'Purchase loan', loanReference: 'HM-SAMPLE-2', dueDate: '2099-01-15', feeId: refs.feeId },
    },
    'POST /orders/:id/pay': { body: { paymentMethod: 'pm_card_visa' } },
    'POST /orders/:id/accept': { body: { version: 1 } },
    'POST /orders/:id/decline': { body: { version: 1, reason: 'Outside our area.' } },
    'POST /assignments/:id/sign': { body: { certify: true, licenceNumber: 'PE-CR-1', jurisdiction: 'Port Ellery', version: 1 } },
    'POST /assignments/:id/new-draft': { body: { version: 1, reason: 'Client sent new sales.' } },
    'POST /reports/:id/reconsiderations': { body: { comment: 'Please weigh the sale at 2 Beacon Row.', sales: [] } },
    'POST /reconsiderations/:id/respond': { body: { decision: 'keep-value', response: 'The value stands; the sale offered is a family transfer.', version: 1 } },
  };
}

/** Sends a request the way the sample says (JSON or multipart), with `body` overriding the sample's
 * JSON body when given. */
export function sendRequest(agent: Agent, route: Pick<ApiRoute, 'method'>, url: string, sample: SampleRequest | undefined, body?: unknown) {
  let req = agent[route.method](url);
  if (sample?.query) req = req.query(sample.query);
  if (route.method === 'get') return req;
  if (sample?.files && body === undefined) {
    for (const [name, value] of Object.entries(sample.fields ?? {})) req = req.field(name, value);
    for (const file of sample.files) req = req.attach(file.field, file.bytes, file.name);
    return req;
  }
  return req.send((body ?? sample?.body ?? {}) as object);
}
