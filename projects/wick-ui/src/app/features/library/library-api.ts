import { DOCUMENT } from '@angular/common';
import { type HttpBackend, HttpClient, type HttpEvent, HttpHeaders, HttpParams, HttpXhrBackend } from '@angular/common/http';
import { Injectable, InjectionToken, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import {
  type BuiltInLiquidRow,
  type DevMailbox,
  type EntryDetail,
  type EntrySummary,
  LIBRARY_COLLECTION,
  type LibraryDataByKind,
  type LibraryKind,
  type ListQuery,
  type Page,
  type PsdForm,
  type Revision,
  type RevisionDiff,
  type RevisionInput,
  type RevisionSummary,
  type SupplierRef,
  type UploadCommitResult,
  type UploadPreview,
} from 'wick-core';

import { CSRF_COOKIE, CSRF_HEADER } from '../../core/auth/auth-store';

/**
 * Uploads go through XMLHttpRequest: the app's fetch-based client reports no upload progress. Tests replace
 * this with the testing backend.
 */
export const UPLOAD_BACKEND = new InjectionToken<HttpBackend>('UPLOAD_BACKEND', { providedIn: 'root', factory: () => inject(HttpXhrBackend) });

function params(query: object): HttpParams {
  let p = new HttpParams();
  for (const [k, v] of Object.entries(query)) {
    if (v !== undefined && v !== null && v !== '') p = p.set(k, String(v));
  }
  return p;
}

/** `/api/library/*` and the dev mailbox: typed calls returning wick-core's wire types. */
@Injectable({ providedIn: 'root' })
export class LibraryApi {
  private readonly http = inject(HttpClient);
  /** Bypasses the interceptors, so the CSRF header is set here from the session's cookie. */
  private readonly uploads = new HttpClient(inject(UPLOAD_BACKEND));
  private readonly document = inject(DOCUMENT);

  private base(kind: LibraryKind): string {
    return `/api/library/${LIBRARY_COLLECTION[kind]}`;
  }

  list(kind: LibraryKind, query: ListQuery): Observable<Page<EntrySummary>> {
    return this.http.get<Page<EntrySummary>>(this.base(kind), { params: params(query) });
  }

  /** Entries of every kind, e.g. the review queue (`state: 'in-review'`). */
  entries(query: ListQuery & { kind?: LibraryKind }): Observable<Page<EntrySummary>> {
    return this.http.get<Page<EntrySummary>>('/api/library/entries', { params: params(query) });
  }

  get<K extends LibraryKind>(kind: K, id: number): Observable<EntryDetail<LibraryDataByKind[K]>> {
    return this.http.get<EntryDetail<LibraryDataByKind[K]>>(`${this.base(kind)}/${id}`);
  }

  create<K extends LibraryKind>(kind: K, input: RevisionInput<LibraryDataByKind[K]>): Observable<EntryDetail<LibraryDataByKind[K]>> {
    return this.http.post<EntryDetail<LibraryDataByKind[K]>>(this.base(kind), input);
  }

  update<K extends LibraryKind>(kind: K, id: number, input: RevisionInput<LibraryDataByKind[K]>, version: number): Observable<EntryDetail<LibraryDataByKind[K]>> {
    return this.http.put<EntryDetail<LibraryDataByKind[K]>>(`${this.base(kind)}/${id}`, { ...input, version });
  }

  transition(kind: LibraryKind, id: number, action: 'submit' | 'approve' | 'return', version: number, comment?: string): Observable<EntryDetail> {
    return this.http.post<EntryDetail>(`${this.base(kind)}/${id}/${action}`, { version, ...(comment ? { comment } : {}) });
  }

  deleteDraft(kind: LibraryKind, id: number, version: number): Observable<{ entry: EntryDetail | null }> {
    return this.http.delete<{ entry: EntryDetail | null }>(`${this.base(kind)}/${id}/draft`, { params: params({ version }) });
  }

  revisions(kind: LibraryKind, id: number): Observable<RevisionSummary[]> {
    return this.http.get<RevisionSummary[]>(`${this.base(kind)}/${id}/revisions`);
  }

  revision(kind: LibraryKind, id: number, number: number): Observable<Revision> {
    return this.http.get<Revision>(`${this.base(kind)}/${id}/revisions/${number}`);
  }

  diff(kind: LibraryKind, id: number, from: number, to: number): Observable<RevisionDiff> {
    return this.http.get<RevisionDiff>(`${this.base(kind)}/${id}/diff`, { params: params({ from, to }) });
  }

  suppliers(): Observable<SupplierRef[]> {
    return this.http.get<SupplierRef[]>('/api/library/suppliers');
  }

  builtInLiquids(): Observable<BuiltInLiquidRow[]> {
    return this.http.get<BuiltInLiquidRow[]>('/api/library/built-in-liquids');
  }

  /** Uploads with progress events; the last event carries the preview. */
  uploadPsd(webId: number, file: File, form?: PsdForm): Observable<HttpEvent<UploadPreview>> {
    return this.upload(`/api/library/webs/${webId}/psd`, file, form ? { form } : {});
  }

  uploadCurve(webId: number, file: File, fields: { name: string; liquid?: string }): Observable<HttpEvent<UploadPreview>> {
    return this.upload(`/api/library/webs/${webId}/curves`, file, fields);
  }

  importWebs(file: File): Observable<HttpEvent<UploadPreview>> {
    return this.upload('/api/library/webs/import', file, {});
  }

  private upload(url: string, file: File, fields: Record<string, string | undefined>): Observable<HttpEvent<UploadPreview>> {
    const body = new FormData();
    for (const [k, v] of Object.entries(fields)) if (v) body.append(k, v);
    body.append('file', file, file.name);
    const token = this.document.cookie
      .split('; ')
      .find((c) => c.startsWith(`${CSRF_COOKIE}=`))
      ?.slice(CSRF_COOKIE.length + 1);
    const headers = token ? new HttpHeaders({ [CSRF_HEADER]: decodeURIComponent(token) }) : undefined;
    return this.uploads.post<UploadPreview>(url, body, { reportProgress: true, observe: 'events', headers });
  }

  commitUpload(uploadId: number, version?: number): Observable<UploadCommitResult> {
    return this.http.post<UploadCommitResult>(`/api/library/uploads/${uploadId}/commit`, version === undefined ? {} : { version });
  }

  discardUpload(uploadId: number): Observable<void> {
    return this.http.delete<void>(`/api/library/uploads/${uploadId}`);
  }

  fileUrl(fileId: number): string {
    return `/api/library/files/${fileId}`;
  }

  mailbox(): Observable<DevMailbox> {
    return this.http.get<DevMailbox>('/api/dev/mailbox');
  }

  clearMailbox(): Observable<DevMailbox> {
    return this.http.delete<DevMailbox>('/api/dev/mailbox');
  }
}
