import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { forkJoin, map, of, switchMap, type Observable } from 'rxjs';
import {
  liquidFromLibrary,
  structureFromLibrary,
  type EntryDetail,
  type EntrySummary,
  type FibreData,
  type LiquidData,
  type Page,
  type PinnedMaterial,
  type Revision,
  type StructureFromLibrary,
  type UserLiquidDefinition,
  type WebData,
} from 'wick-core';

/** A library entry to pick, with the revision a variant would pin and whether that one is approved. */
export interface LibraryChoice {
  readonly id: number;
  readonly name: string;
  /** Approved revision in force, else the newest. */
  readonly revision: number;
  readonly state: string;
  readonly approved: boolean;
}

function choice(e: EntrySummary): LibraryChoice {
  const revision = e.approvedRevision ?? e.headRevision;
  const state = e.approvedRevision !== null ? 'approved' : e.state;
  return { id: e.id, name: e.name, revision, state, approved: state === 'approved' };
}

/** The revision a variant pins: the approved one in force, else the newest (draft or in review). */
function pinnedRevision<D>(d: EntryDetail<D>): Revision<D> {
  return d.approved ?? d.head;
}

/** Reads the material library for the variant builder (`/api/library/*`). */
@Injectable({ providedIn: 'root' })
export class LibraryLookup {
  private readonly http = inject(HttpClient);

  webs(): Observable<LibraryChoice[]> {
    return this.http.get<Page<EntrySummary>>('/api/library/webs', { params: { pageSize: 200, sort: 'name' } }).pipe(map((p) => p.items.map(choice)));
  }

  liquids(): Observable<LibraryChoice[]> {
    return this.http.get<Page<EntrySummary>>('/api/library/liquids', { params: { pageSize: 200, sort: 'name' } }).pipe(map((p) => p.items.map(choice)));
  }

  /**
   * A web as variant structure inputs: its pinned revision, its blend's fibres (approved revisions where there
   * are) and the contact angle for the liquid (water's for an aqueous liquid, with a note).
   */
  webStructure(id: number, liquidName: string, aqueous: boolean): Observable<StructureFromLibrary> {
    return this.http.get<EntryDetail<WebData>>(`/api/library/webs/${id}`).pipe(
      switchMap((web) => {
        const rev = pinnedRevision(web);
        const fibreIds = [...new Set(rev.data.blend.map((b) => b.fibreId).filter((x): x is number => x !== undefined))];
        const fibres$ = fibreIds.length
          ? forkJoin(fibreIds.map((fid) => this.http.get<EntryDetail<FibreData>>(`/api/library/fibres/${fid}`)))
          : of([] as EntryDetail<FibreData>[]);
        return fibres$.pipe(
          map((fibres) => {
            const pinned: PinnedMaterial & { data: WebData } = { kind: 'web', id: web.id, revision: rev.number, name: rev.name, state: rev.state, data: rev.data };
            return structureFromLibrary(
              pinned,
              fibres.map((f) => {
                const fr = pinnedRevision(f);
                return { id: f.id, name: fr.name, data: fr.data };
              }),
              liquidName,
              { aqueous },
            );
          }),
        );
      }),
    );
  }

  /** A library liquid as the evaluator's liquid definition, with its pin. */
  liquid(id: number): Observable<{ definition: UserLiquidDefinition; pinned: PinnedMaterial }> {
    return this.http.get<EntryDetail<LiquidData>>(`/api/library/liquids/${id}`).pipe(
      map((d) => {
        const rev = pinnedRevision(d);
        const pinned: PinnedMaterial = { kind: 'liquid', id: d.id, revision: rev.number, name: rev.name, state: rev.state };
        return { definition: liquidFromLibrary({ ...pinned, data: rev.data }), pinned };
      }),
    );
  }
}
