import { HttpClient, type HttpEvent, type HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CurveImportList, CurveImportReport } from '../../../shared/api/api-schemas';

/** The curve-import operations, one method each. */
@Injectable({ providedIn: 'root' })
export class CurveImportApi {
  private readonly http = inject(HttpClient);

  /** The upload's events (progress of the bytes sent, then the report); unsubscribing aborts it. */
  importCurveTable(supplierId: number, file: File, dryRun: boolean): Observable<HttpEvent<CurveImportReport>> {
    const body = new FormData();
    body.append('dryRun', String(dryRun));
    body.append('file', file, file.name);
    return this.http.post<CurveImportReport>(`/api/v1/suppliers/${supplierId}/curve-imports`, body, {
      observe: 'events',
      reportProgress: true,
    });
  }

  listCurveImports(supplierId: number): Observable<CurveImportList> {
    return this.http.get<CurveImportList>(`/api/v1/suppliers/${supplierId}/curve-imports`);
  }

  exportCurveTable(supplierId: number): Observable<HttpResponse<Blob>> {
    return this.http.get(`/api/v1/suppliers/${supplierId}/curve-table`, { responseType: 'blob', observe: 'response' });
  }
}
