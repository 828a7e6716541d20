import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { AdminUser, AuditFilter, AuditPage, RoleOverrides } from 'wick-core';

/** `/api/admin/*`: people with their role overrides, and the audit log. */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly http = inject(HttpClient);

  users(): Observable<AdminUser[]> {
    return this.http.get<AdminUser[]>('/api/admin/users');
  }

  setRoles(id: number, overrides: RoleOverrides): Observable<AdminUser> {
    return this.http.put<AdminUser>(`/api/admin/users/${id}/roles`, overrides);
  }

  audit(filter: AuditFilter): Observable<AuditPage> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(filter)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<AuditPage>('/api/admin/audit', { params });
  }
}
