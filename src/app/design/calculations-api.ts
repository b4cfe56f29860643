import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  CableRunRequest,
  CableRunResponse,
  OperatingPointRequest,
  OperatingPointResponse,
  SelectionRequest,
  SelectionResponse,
  SystemCurveRequest,
  SystemCurveResponse,
} from '../../../shared/api/api-schemas';

/** The calculation and selection operations, one method each. */
@Injectable({ providedIn: 'root' })
export class CalculationsApi {
  private readonly http = inject(HttpClient);

  calculateSystemCurve(body: SystemCurveRequest): Observable<SystemCurveResponse> {
    return this.http.post<SystemCurveResponse>('/api/v1/calculations/system-curve', body);
  }

  calculateOperatingPoint(body: OperatingPointRequest): Observable<OperatingPointResponse> {
    return this.http.post<OperatingPointResponse>('/api/v1/calculations/operating-point', body);
  }

  calculateCableRun(body: CableRunRequest): Observable<CableRunResponse> {
    return this.http.post<CableRunResponse>('/api/v1/calculations/cable-run', body);
  }

  searchSelections(body: SelectionRequest): Observable<SelectionResponse> {
    return this.http.post<SelectionResponse>('/api/v1/selections', body);
  }
}
