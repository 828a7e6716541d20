import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { EntryDetail, LibraryKind } from 'wick-core';
import { type ApiProblem, apiProblem } from './api-error';
import { LibraryApi } from './library-api';

interface EntryState {
  readonly entry: EntryDetail | null;
  readonly loading: boolean;
  readonly busy: boolean;
  readonly problem: ApiProblem | null;
  /** A sentence about what just happened (saved, submitted, changed meanwhile …). */
  readonly notice: string;
  /** True once the entry was deleted with its only draft. */
  readonly deleted: boolean;
}

const INITIAL: EntryState = { entry: null, loading: false, busy: false, problem: null, notice: '', deleted: false };

/** One library entry on its page: loading, review actions and the optimistic-locking conflicts they may meet. */
@Injectable()
export class EntryStore {
  private readonly api = inject(LibraryApi);
  private readonly state = signal<EntryState>(INITIAL);
  private kind: LibraryKind = 'web';
  private id = 0;

  readonly entry = computed(() => this.state().entry);
  readonly loading = computed(() => this.state().loading);
  readonly busy = computed(() => this.state().busy);
  readonly problem = computed(() => this.state().problem);
  readonly notice = computed(() => this.state().notice);
  readonly deleted = computed(() => this.state().deleted);

  async load(kind: LibraryKind, id: number): Promise<void> {
    this.kind = kind;
    this.id = id;
    this.state.update((s) => ({ ...s, loading: true, problem: null }));
    try {
      const entry = await firstValueFrom(this.api.get(kind, id));
      this.state.update((s) => ({ ...s, entry, loading: false }));
    } catch (e) {
      this.state.update((s) => ({ ...s, loading: false, problem: apiProblem(e) }));
    }
  }

  /** After an upload was committed elsewhere on the page. */
  reload(notice = ''): Promise<void> {
    this.state.update((s) => ({ ...s, notice }));
    return this.load(this.kind, this.id);
  }

  submit(): Promise<void> {
    return this.transition('submit', undefined, 'Submitted for review. Every reviewer gets an e-mail.');
  }

  approve(comment?: string): Promise<void> {
    return this.transition('approve', comment, 'Approved: this revision is now in force. The submitter gets an e-mail.');
  }

  returnWith(comment: string): Promise<void> {
    return this.transition('return', comment, 'Returned with your comment. The submitter gets an e-mail.');
  }

  async deleteDraft(): Promise<void> {
    const entry = this.entry();
    if (!entry) return;
    await this.act(async () => {
      const { entry: remaining } = await firstValueFrom(this.api.deleteDraft(this.kind, this.id, entry.version));
      this.state.update((s) => ({
        ...s,
        entry: remaining,
        deleted: remaining === null,
        notice: remaining ? 'The draft was deleted; the approved revision is shown again.' : 'The draft and its entry were deleted.',
      }));
    });
  }

  private async transition(action: 'submit' | 'approve' | 'return', comment: string | undefined, done: string): Promise<void> {
    const entry = this.entry();
    if (!entry) return;
    await this.act(async () => {
      const next = await firstValueFrom(this.api.transition(this.kind, this.id, action, entry.version, comment));
      this.state.update((s) => ({ ...s, entry: next, notice: done }));
    });
  }

  private async act(work: () => Promise<void>): Promise<void> {
    this.state.update((s) => ({ ...s, busy: true, problem: null, notice: '' }));
    try {
      await work();
    } catch (e) {
      const problem = apiProblem(e);
      const current = (problem.details as { current?: EntryDetail } | undefined)?.current;
      // A stale version: show what is there now, and say so; nothing of ours was stored.
      this.state.update((s) => ({ ...s, problem, entry: problem.code === 'version-conflict' && current ? current : s.entry }));
    } finally {
      this.state.update((s) => ({ ...s, busy: false }));
    }
  }
}
