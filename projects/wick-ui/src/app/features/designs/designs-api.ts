import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  DesignSummary,
  DesignWrite,
  ProjectDetail,
  ProjectSummary,
  ProjectWrite,
  RerunRequest,
  VariantDetail,
  VariantReport,
  VariantWrite,
} from 'wick-core';

/** `/api/projects`, `/api/designs`, `/api/variants`: the design workspace on the server (the record). */
@Injectable({ providedIn: 'root' })
export class DesignsApi {
  private readonly http = inject(HttpClient);

  projects(): Observable<ProjectSummary[]> {
    return this.http.get<ProjectSummary[]>('/api/projects');
  }

  project(id: number): Observable<ProjectDetail> {
    return this.http.get<ProjectDetail>(`/api/projects/${id}`);
  }

  createProject(write: ProjectWrite): Observable<ProjectDetail> {
    return this.http.post<ProjectDetail>('/api/projects', write);
  }

  createDesign(projectId: number, write: DesignWrite): Observable<DesignSummary> {
    return this.http.post<DesignSummary>(`/api/projects/${projectId}/designs`, write);
  }

  design(id: number): Observable<DesignSummary & { projectName: string }> {
    return this.http.get<DesignSummary & { projectName: string }>(`/api/designs/${id}`);
  }

  variant(id: number): Observable<VariantDetail> {
    return this.http.get<VariantDetail>(`/api/variants/${id}`);
  }

  createVariant(designId: number, write: VariantWrite): Observable<VariantDetail> {
    return this.http.post<VariantDetail>(`/api/designs/${designId}/variants`, write);
  }

  updateVariant(id: number, write: VariantWrite): Observable<VariantDetail> {
    return this.http.put<VariantDetail>(`/api/variants/${id}`, write);
  }

  deleteVariant(id: number): Observable<void> {
    return this.http.delete<void>(`/api/variants/${id}`);
  }

  rerun(id: number, req: RerunRequest): Observable<VariantDetail> {
    return this.http.post<VariantDetail>(`/api/variants/${id}/rerun`, req);
  }

  report(id: number): Observable<VariantReport> {
    return this.http.get<VariantReport>(`/api/variants/${id}/report`);
  }

  /** Download address of a variant's CSV (summary or curves). */
  csvUrl(id: number, what: 'summary' | 'curve' = 'summary'): string {
    return `/api/variants/${id}/export.csv?what=${what}`;
  }
}
