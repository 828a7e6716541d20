import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CompareResponse, ComparisonReport, DecisionRecord, DecisionWrite } from 'wick-core';

/** `/api/compare`, `/api/decisions`. */
@Injectable({ providedIn: 'root' })
export class CompareApi {
  private readonly http = inject(HttpClient);

  compare(ids: readonly number[], baseline: number | null): Observable<CompareResponse> {
    return this.http.get<CompareResponse>('/api/compare', { params: this.params(ids, baseline) });
  }

  report(ids: readonly number[], baseline: number | null): Observable<ComparisonReport> {
    return this.http.get<ComparisonReport>('/api/compare/report', { params: this.params(ids, baseline) });
  }

  decide(write: DecisionWrite): Observable<DecisionRecord> {
    return this.http.post<DecisionRecord>('/api/decisions', write);
  }

  /** Download address of the comparison CSV. */
  csvUrl(ids: readonly number[], baseline: number | null): string {
    return `/api/compare/export.csv?variants=${ids.join(',')}${baseline ? `&baseline=${baseline}` : ''}`;
  }

  private params(ids: readonly number[], baseline: number | null): Record<string, string> {
    return baseline ? { variants: ids.join(','), baseline: String(baseline) } : { variants: ids.join(',') };
  }
}
