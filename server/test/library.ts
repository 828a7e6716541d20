import { randomUUID } from 'node:crypto';
import type { EntryDetail, FibreData, LiquidData, PropertySource, PropertyValue, RevisionInput, WebData } from 'wick-core';
import type { Agent } from './sign-in';

/** A property value in SI with the unit it was "typed" in. */
export const pv = (si: number, unit: string, source: PropertySource = 'measured'): PropertyValue => ({ si, unit, source });

/** A name no other spec uses, so specs sharing the test database never see each other's rows. */
export function uniqueName(prefix: string): string {
  return `${prefix} ${randomUUID().slice(0, 8)}`;
}

export function webInput(name: string, data: Partial<WebData> = {}): RevisionInput<WebData> {
  return {
    name,
    supplierId: null,
    notes: 'test web',
    data: {
      webKind: 'airlaid',
      blend: [{ fibreName: 'Fluff pulp', massFraction: 1 }],
      basisWeight: pv(0.12, 'g/m^2'),
      thickness: pv(0.0015, 'mm'),
      thicknessPressure: pv(500, 'kPa'),
      porosityMode: 'measured',
      porosity: pv(0.92, '%'),
      curves: [],
      ...data,
    },
  };
}

export function fibreInput(name: string, data: Partial<FibreData> = {}): RevisionInput<FibreData> {
  return {
    name,
    supplierId: null,
    notes: '',
    data: {
      polymer: 'polypropylene',
      density: pv(910, 'kg/m^3', 'handbook'),
      linearDensity: pv(1.7e-7, 'dtex', 'supplier-datasheet'),
      contactAngles: [],
      ...data,
    },
  };
}

export function liquidInput(name: string, data: Partial<LiquidData> = {}): RevisionInput<LiquidData> {
  const at20 = pv(293.15, 'degC');
  return {
    name,
    supplierId: null,
    notes: '',
    data: {
      surfaceTension: { mode: 'constant', value: pv(0.0705, 'mN/m'), temperature: at20 },
      viscosity: { mode: 'constant', value: pv(0.00102, 'mPa s'), temperature: at20 },
      density: { mode: 'constant', value: pv(1004.6, 'kg/m^3'), temperature: at20 },
      flammable: false,
      ...data,
    },
  };
}

/** Creates a web as `agent` and returns the entry (expects 201). */
export async function createWeb(agent: Agent, name: string, data: Partial<WebData> = {}): Promise<EntryDetail<WebData>> {
  const res = await agent.post('/api/library/webs').send(webInput(name, data));
  if (res.status !== 201) throw new Error(`create web: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as EntryDetail<WebData>;
}

/** POST …/webs/:id/{submit|approve|return} with the given version. */
export function transition(agent: Agent, id: number, action: 'submit' | 'approve' | 'return', version: number, comment?: string) {
  return agent.post(`/api/library/webs/${id}/${action}`).send({ version, ...(comment !== undefined ? { comment } : {}) });
}
