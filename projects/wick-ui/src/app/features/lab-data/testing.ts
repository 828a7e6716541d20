import { analyseLabRun, DEFAULT_FIT_SETTINGS, gravityHeight, labRunFigures, type LabRunDetail, type LabSetDetail, replicateFigures } from 'wick-core';

/** Test fixtures: a vertical saline run generated with wick-core (a = 3e-5 m²/s, b = 5e-4 m/s, no noise). */
export const PRIYA = { id: 1, name: 'Priya Raman' };

export function labRun(over: Partial<LabRunDetail> = {}, a = 3e-5, b = 5e-4): LabRunDetail {
  const times = Array.from({ length: 30 }, (_, i) => (i + 1) * 20);
  const values = times.map((t) => gravityHeight(a, b, t));
  const liquid = {
    source: 'built-in' as const,
    builtInId: 'saline-0.9',
    entryId: null,
    revision: null,
    name: '0.9 % NaCl saline',
    surfaceTension: 0.0727,
    viscosity: 0.95e-3,
    density: 1004.6,
    flammable: false,
    sources: { surfaceTension: 'IAPWS + 0.25 mN/m', viscosity: 'handbook', density: 'handbook' },
    remarks: [],
  };
  const web = { entryId: 7, revision: 2, name: 'TAB-40 acquisition layer', state: 'approved', porosity: 0.9 };
  const fit = over.fit ?? DEFAULT_FIT_SETTINGS;
  const analysis = analyseLabRun({ times, readings: values, measurement: 'height', orientation: 'vertical', tilt: Math.PI / 2, liquid, porosity: 0.9, fit });
  return {
    id: 11,
    version: 1,
    name: 'Specimen 1',
    set: { id: 5, name: 'TAB-40 saline' },
    web,
    liquidName: liquid.name,
    temperature: 296.15,
    orientation: 'vertical',
    measurement: 'height',
    points: times.length,
    measuredAt: null,
    createdBy: PRIYA,
    createdAt: '2026-11-30T10:00:00.000Z',
    figures: labRunFigures(analysis),
    liquid,
    tilt: Math.PI / 2,
    width: 0.025,
    thickness: null,
    conditions: '23 °C, 50 % RH',
    notes: '',
    times,
    values,
    timeUnit: 's',
    valueUnit: 'mm',
    file: { fileId: 3, fileName: 'specimen-1.csv', sha256: 'ab'.repeat(32) },
    fit,
    analysis,
    updatedBy: PRIYA,
    updatedAt: '2026-11-30T10:00:00.000Z',
    actions: { edit: true, delete: true },
    ...over,
  };
}

/** A set of four runs, the fourth wicking at half the rate (flagged as an outlier). */
export function labSet(over: Partial<LabSetDetail> = {}): LabSetDetail {
  const runs = [1, 2, 3, 4].map((i) => labRun({ id: 10 + i, name: `Specimen ${i}` }, i === 4 ? 1.5e-5 : 3e-5 * (1 + 0.01 * i)));
  const { figures, warnings } = replicateFigures(runs.map((r) => ({ id: r.id, name: r.name, analysis: r.analysis })), 'height');
  return {
    id: 5,
    version: 4,
    name: 'TAB-40 saline',
    notes: '',
    webId: 7,
    webName: 'TAB-40 acquisition layer',
    liquidName: '0.9 % NaCl saline',
    orientation: 'vertical',
    measurement: 'height',
    runCount: runs.length,
    createdBy: PRIYA,
    createdAt: '2026-11-30T10:00:00.000Z',
    proposals: [],
    runs: runs.map(({ liquid: _l, tilt: _t, width: _w, thickness: _th, conditions: _c, notes: _n, times: _ti, values: _v, timeUnit: _tu, valueUnit: _vu, file: _f, fit: _fi, analysis: _a, updatedBy: _u, updatedAt: _ua, actions: _ac, ...summary }) => summary),
    figures,
    warnings,
    actions: { edit: true, propose: true },
    ...over,
  };
}
