import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { forkJoin, map, of, switchMap, type Observable } from 'rxjs';
import { stackLayerFromLibrary, type EntryDetail, type FibreData, type LibraryFibre, type StackLayerFromLibrary, type WebData } from 'wick-core';

/** The revision a variant pins: the approved one in force, else the newest (as the layer editor pins). */
const pinnedOf = <D>(d: EntryDetail<D>) => d.approved ?? d.head;

/** A library web as a stack layer (`/api/library/webs/:id` and its blend's fibres). */
@Injectable({ providedIn: 'root' })
export class StackLibrary {
  private readonly http = inject(HttpClient);

  /**
   * The web's pinned revision mapped by wick-core for a stack: through-plane permeability, retention from the
   * pore-size distribution when the web has one, the fibre's contact angle for the liquid.
   */
  webLayer(id: number, liquidName: string, aqueous: boolean): Observable<StackLayerFromLibrary> {
    return this.http.get<EntryDetail<WebData>>(`/api/library/webs/${id}`).pipe(
      switchMap((entry) => {
        const rev = pinnedOf(entry);
        const ids = [...new Set(rev.data.blend.flatMap((b) => (b.fibreId === undefined ? [] : [b.fibreId])))];
        const fibres: Observable<LibraryFibre[]> = ids.length
          ? forkJoin(ids.map((f) => this.http.get<EntryDetail<FibreData>>(`/api/library/fibres/${f}`))).pipe(
              map((list) => list.map((f) => ({ id: f.id, name: pinnedOf(f).name, data: pinnedOf(f).data }))),
            )
          : of([]);
        const web = { kind: 'web' as const, id: entry.id, revision: rev.number, name: rev.name, state: rev.state, data: rev.data };
        return fibres.pipe(map((f) => stackLayerFromLibrary(web, f, liquidName, { aqueous })));
      }),
    );
  }
}
