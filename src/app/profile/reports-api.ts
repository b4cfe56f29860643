import { HttpClient, type HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  CompanyProfile,
  CompanyProfileInput,
  ReportList,
  ReportRequest,
  ReportSummary,
} from '../../../shared/api/api-schemas';
import { problemShownByCaller } from '../core/problem-details-interceptor';

/** The company profile and a project's proposals and parts list, one method per endpoint. */
@Injectable({ providedIn: 'root' })
export class ReportsApi {
  private readonly http = inject(HttpClient);

  getProfile(): Observable<CompanyProfile> {
    return this.http.get<CompanyProfile>('/api/v1/account/profile');
  }

  updateProfile(profile: CompanyProfileInput): Observable<CompanyProfile> {
    return this.http.put<CompanyProfile>('/api/v1/account/profile', profile, problemShownByCaller());
  }

  getLogo(): Observable<Blob> {
    return this.http.get('/api/v1/account/profile/logo', { responseType: 'blob' });
  }

  uploadLogo(file: File): Observable<CompanyProfile> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.put<CompanyProfile>('/api/v1/account/profile/logo', body, problemShownByCaller());
  }

  createReport(projectId: number, request: ReportRequest): Observable<ReportSummary> {
    return this.http.post<ReportSummary>(`/api/v1/projects/${projectId}/reports`, request, problemShownByCaller());
  }

  listReports(projectId: number): Observable<ReportList> {
    return this.http.get<ReportList>(`/api/v1/projects/${projectId}/reports`);
  }

  /** A stored report's PDF; `downloadPath` is the summary's. */
  downloadReport(downloadPath: string): Observable<HttpResponse<Blob>> {
    return this.http.get(downloadPath, { responseType: 'blob', observe: 'response' });
  }

  downloadPartsList(projectId: number, wasteAllowancePercent: number): Observable<HttpResponse<Blob>> {
    return this.http.get(`/api/v1/projects/${projectId}/parts-list.csv`, {
      params: { wasteAllowancePercent },
      responseType: 'blob',
      observe: 'response',
    });
  }
}
