import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  PumpDetail,
  PumpListQuery,
  PumpPage,
  PumpRevisionQuery,
  SupplierList,
} from '../../../shared/api/api-schemas';

/** The catalog operations, one method each. */
@Injectable({ providedIn: 'root' })
export class CatalogApi {
  private readonly http = inject(HttpClient);

  listSuppliers(): Observable<SupplierList> {
    return this.http.get<SupplierList>('/api/v1/suppliers');
  }

  listPumps(query: PumpListQuery): Observable<PumpPage> {
    let params = new HttpParams();
    for (const [name, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(name, String(value));
    }
    return this.http.get<PumpPage>('/api/v1/pumps', { params });
  }

  getPump(pumpId: number, revision?: PumpRevisionQuery['revision']): Observable<PumpDetail> {
    const params = revision === undefined ? undefined : new HttpParams().set('revision', String(revision));
    return this.http.get<PumpDetail>(`/api/v1/pumps/${pumpId}`, { params });
  }
}
