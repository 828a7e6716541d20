import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  ContactAngleAnalysis,
  EntrySummary,
  LabRunCreate,
  LabRunDetail,
  LabRunSummary,
  LabRunUpdate,
  LabSetDetail,
  LabSetSummary,
  LabSetUpdate,
  Page,
  PredictionCandidate,
  PredictionComparison,
  ProposeRequest,
  EntryDetail,
  WebData,
} from 'wick-core';

function params(query: Record<string, string | number | undefined>): HttpParams {
  let p = new HttpParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== '') p = p.set(k, String(v));
  return p;
}

/** `/api/lab-data/*` (runs, sets, fits, contact angle, predictions, proposals) and the library lists the upload form needs. */
@Injectable({ providedIn: 'root' })
export class LabDataApi {
  private readonly http = inject(HttpClient);

  runs(query: { setId?: number; webId?: number } = {}): Observable<LabRunSummary[]> {
    return this.http.get<LabRunSummary[]>('/api/lab-data/runs', { params: params(query) });
  }

  run(id: number): Observable<LabRunDetail> {
    return this.http.get<LabRunDetail>(`/api/lab-data/runs/${id}`);
  }

  /** The CSV and the run's details in one multipart request (the CSRF interceptor adds its header). */
  createRun(meta: LabRunCreate, file: File): Observable<LabRunDetail> {
    const body = new FormData();
    body.append('meta', JSON.stringify(meta));
    body.append('file', file, file.name);
    return this.http.post<LabRunDetail>('/api/lab-data/runs', body);
  }

  updateRun(id: number, update: LabRunUpdate): Observable<LabRunDetail> {
    return this.http.put<LabRunDetail>(`/api/lab-data/runs/${id}`, update);
  }

  deleteRun(id: number, version: number): Observable<void> {
    return this.http.delete<void>(`/api/lab-data/runs/${id}`, { params: params({ version }) });
  }

  fileUrl(runId: number): string {
    return `/api/lab-data/runs/${runId}/file`;
  }

  sets(query: { webId?: number } = {}): Observable<LabSetSummary[]> {
    return this.http.get<LabSetSummary[]>('/api/lab-data/sets', { params: params(query) });
  }

  set(id: number): Observable<LabSetDetail> {
    return this.http.get<LabSetDetail>(`/api/lab-data/sets/${id}`);
  }

  updateSet(id: number, update: LabSetUpdate): Observable<LabSetDetail> {
    return this.http.put<LabSetDetail>(`/api/lab-data/sets/${id}`, update);
  }

  propose(setId: number, request: ProposeRequest): Observable<LabSetDetail> {
    return this.http.post<LabSetDetail>(`/api/lab-data/sets/${setId}/propose`, request);
  }

  contactAngle(reference: number, test: number): Observable<ContactAngleAnalysis> {
    return this.http.get<ContactAngleAnalysis>('/api/lab-data/contact-angle', { params: params({ reference, test }) });
  }

  predictions(runId: number): Observable<PredictionCandidate[]> {
    return this.http.get<PredictionCandidate[]>(`/api/lab-data/runs/${runId}/predictions`);
  }

  comparison(runId: number, variantId: number): Observable<PredictionComparison> {
    return this.http.get<PredictionComparison>(`/api/lab-data/runs/${runId}/predictions/${variantId}`);
  }

  /** Library lists for the upload form (newest revision of each entry). */
  webs(): Observable<Page<EntrySummary>> {
    return this.http.get<Page<EntrySummary>>('/api/library/webs', { params: params({ pageSize: 200, sort: 'name' }) });
  }

  liquids(): Observable<Page<EntrySummary>> {
    return this.http.get<Page<EntrySummary>>('/api/library/liquids', { params: params({ pageSize: 200, sort: 'name' }) });
  }

  /** The web's entry (its version is what a proposal must name). */
  web(id: number): Observable<EntryDetail<WebData>> {
    return this.http.get<EntryDetail<WebData>>(`/api/library/webs/${id}`);
  }
}
