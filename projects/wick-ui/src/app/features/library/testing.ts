import type { EntryDetail, Revision, RevisionSummary, WebData } from 'wick-core';

/** Test data and helpers for the library specs (shapes of wick-core's wire types). */

/** Lets promise chains started by a click or a flush finish, and the view follow. */
export async function settle(fixture: { whenStable(): Promise<unknown> }): Promise<void> {
  await new Promise((r) => setTimeout(r));
  await fixture.whenStable();
}
export const TOMAS = { id: 2, name: 'Tomás Lindqvist' };
export const GRACE = { id: 3, name: 'Grace Adebayo' };

export function webData(over: Partial<WebData> = {}): WebData {
  return {
    webKind: 'airlaid',
    blend: [{ fibreId: 11, fibreName: 'Pinecrest fluff pulp', massFraction: 1 }],
    basisWeight: { si: 0.15, unit: 'g/m^2', source: 'supplier-datasheet' },
    thickness: { si: 0.0019, unit: 'mm', source: 'measured' },
    thicknessPressure: { si: 500, unit: 'kPa', source: 'measured' },
    porosityMode: 'computed',
    porosity: { si: 0.946, unit: '%', source: 'estimate', note: 'Computed' },
    curves: [],
    ...over,
  };
}

export function revision(over: Partial<Revision<WebData>> = {}): Revision<WebData> {
  return {
    number: 1,
    state: 'draft',
    name: 'AL-150 airlaid core',
    superseded: false,
    createdBy: TOMAS,
    createdAt: '2026-11-01T09:00:00.000Z',
    updatedBy: TOMAS,
    updatedAt: '2026-11-01T09:30:00.000Z',
    submittedBy: null,
    submittedAt: null,
    reviewedBy: null,
    reviewedAt: null,
    reviewComment: null,
    supplier: { id: 3, name: 'Pinecrest Pulp Co.' },
    notes: '',
    data: webData(),
    ...over,
  };
}

export function summaryOf(r: Revision): RevisionSummary {
  const { supplier: _s, notes: _n, data: _d, ...summary } = r;
  return summary;
}

export function webEntry(over: Partial<EntryDetail<WebData>> = {}, head: Partial<Revision<WebData>> = {}): EntryDetail<WebData> {
  const h = revision(head);
  return {
    id: 7,
    kind: 'web',
    version: 4,
    head: h,
    approved: null,
    revisions: [summaryOf(h)],
    actions: { edit: true, submit: h.state === 'draft' || h.state === 'returned', approve: false, return: false, deleteDraft: h.state === 'draft' },
    ...over,
  };
}
