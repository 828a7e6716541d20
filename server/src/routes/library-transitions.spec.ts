import type { Express } from 'express';
import type { EntryDetail, RevisionState } from 'wick-core';
import { createWeb, transition, uniqueName, webInput } from '../../test/library';
import { startTestMailbox, type TestMailbox } from '../../test/mail';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp } from '../../test/test-app';

type Action = 'update' | 'submit' | 'approve' | 'return' | 'deleteDraft';
type Actor = 'tomas' | 'lena' | 'grace' | 'priya' | 'martin' | 'ada';

const STATES: readonly RevisionState[] = ['draft', 'in-review', 'approved', 'returned'];
const ACTIONS: readonly Action[] = ['update', 'submit', 'approve', 'return', 'deleteDraft'];
/** Who: materials scientist, materials scientist + reviewer, reviewer, engineer, programme manager, administrator. */
const ACTORS: Record<Actor, string> = {
  tomas: 'materials-scientist',
  lena: 'lena',
  grace: 'reviewer',
  priya: 'engineer',
  martin: 'program-manager',
  ada: 'admin',
};

const EDITORS: readonly Actor[] = ['tomas', 'lena'];
const REVIEWERS: readonly Actor[] = ['grace', 'lena'];

/**
 * The rule table this spec checks the server against: the permission first (403), then the state (409).
 * Entries are written and submitted by Tomás, so Lena and Grace are never the authors (four-eyes is its own spec).
 */
function expected(state: RevisionState, action: Action, actor: Actor): number {
  const editing = action === 'update' || action === 'submit' || action === 'deleteDraft';
  if (editing && !EDITORS.includes(actor)) return 403;
  if (!editing && !REVIEWERS.includes(actor)) return 403;
  switch (action) {
    case 'update':
      return state === 'in-review' ? 409 : 200;
    case 'submit':
      return state === 'draft' || state === 'returned' ? 200 : 409;
    case 'approve':
    case 'return':
      return state === 'in-review' ? 200 : 409;
    case 'deleteDraft':
      return state === 'draft' ? 200 : 409;
  }
}

/** What each allowed action leaves behind. */
const AFTER: Record<Action, (before: RevisionState) => RevisionState | 'gone'> = {
  update: () => 'draft',
  submit: () => 'in-review',
  approve: () => 'approved',
  return: () => 'returned',
  deleteDraft: () => 'gone',
};

describe('library state transitions: every action in every state, by every role', () => {
  let mail: TestMailbox;
  let app: Express;
  const agents = {} as Record<Actor, Agent>;

  beforeAll(async () => {
    mail = await startTestMailbox();
    app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
    for (const [actor, who] of Object.entries(ACTORS) as [Actor, string][]) agents[actor] = (await signInAs(app, who)).agent;
  });
  afterAll(async () => mail.stop());

  /** A web by Tomás brought into `state` (Grace decides where a decision is needed). */
  async function webIn(state: RevisionState): Promise<EntryDetail> {
    let e: EntryDetail = await createWeb(agents.tomas, uniqueName(`Matrix ${state}`));
    if (state === 'draft') return e;
    e = (await transition(agents.tomas, e.id, 'submit', e.version).expect(200)).body;
    if (state === 'in-review') return e;
    const decision = state === 'approved' ? 'approve' : 'return';
    return (await transition(agents.grace, e.id, decision, e.version, 'Decided for the matrix.').expect(200)).body;
  }

  /** Refusals change nothing (each case checks that), so they share one entry per state. */
  const shared = new Map<RevisionState, Promise<EntryDetail>>();
  function sharedWebIn(state: RevisionState): Promise<EntryDetail> {
    let e = shared.get(state);
    if (!e) shared.set(state, (e = webIn(state)));
    return e;
  }

  function act(actor: Actor, action: Action, e: EntryDetail) {
    const agent = agents[actor];
    if (action === 'update') return agent.put(`/api/library/webs/${e.id}`).send({ ...webInput(e.head.name), version: e.version });
    if (action === 'deleteDraft') return agent.delete(`/api/library/webs/${e.id}/draft`).query({ version: e.version });
    return transition(agent, e.id, action, e.version, action === 'return' ? 'Needs another look.' : undefined);
  }

  for (const state of STATES) {
    for (const action of ACTIONS) {
      for (const actor of Object.keys(ACTORS) as Actor[]) {
        const status = expected(state, action, actor);
        it(`when ${actor} (${ACTORS[actor]}) tries "${action}" on a ${state} revision, then ${status}`, async () => {
          const e = status === 200 ? await webIn(state) : await sharedWebIn(state);
          const res = await act(actor, action, e);
          expect(res.status).withContext(JSON.stringify(res.body).slice(0, 300)).toBe(status);
          const now = await agents.priya.get(`/api/library/webs/${e.id}`);
          if (status === 200) {
            const after = AFTER[action](state);
            if (after === 'gone') expect(now.status).toBe(404);
            else {
              expect((now.body as EntryDetail).head.state).toBe(after);
              expect((now.body as EntryDetail).version).toBe(e.version + 1);
            }
          } else {
            expect(res.body.error.code).toBe(status === 403 ? 'forbidden' : 'wrong-state');
            // A refused action changes nothing.
            expect((now.body as EntryDetail).version).toBe(e.version);
            expect((now.body as EntryDetail).head.state).toBe(state);
          }
        });
      }
    }
  }
});
