import { HttpClient, HttpHeaders, type HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { map, type Observable } from 'rxjs';
import type {
  Project,
  ProjectInput,
  ProjectList,
  ProjectRecheck,
  ProjectRevisionList,
  RevisionComparison,
} from '../../../../shared/api/api-schemas';
import { problemShownByCaller } from '../../core/problem-details-interceptor';

/** A project with the ETag of its revision, for `If-Match` on the next save. */
export interface ProjectWithTag {
  project: Project;
  etag: string | null;
}

function withTag(response: HttpResponse<Project>): ProjectWithTag {
  return { project: response.body!, etag: response.headers.get('ETag') };
}

/** The signed-in designer's saved projects, one method per operation. */
@Injectable({ providedIn: 'root' })
export class ProjectsApi {
  private readonly http = inject(HttpClient);

  listProjects(): Observable<ProjectList> {
    return this.http.get<ProjectList>('/api/v1/projects');
  }

  createProject(input: ProjectInput): Observable<ProjectWithTag> {
    return this.http
      .post<Project>('/api/v1/projects', input, { ...problemShownByCaller(), observe: 'response' })
      .pipe(map(withTag));
  }

  getProject(projectId: number): Observable<ProjectWithTag> {
    return this.http.get<Project>(`/api/v1/projects/${projectId}`, { observe: 'response' }).pipe(map(withTag));
  }

  /** Saves on the revision `etag` names; a 412 when the project was saved since. */
  updateProject(projectId: number, input: ProjectInput, etag: string | null): Observable<ProjectWithTag> {
    const headers = etag ? new HttpHeaders({ 'If-Match': etag }) : undefined;
    return this.http
      .put<Project>(`/api/v1/projects/${projectId}`, input, { ...problemShownByCaller(), headers, observe: 'response' })
      .pipe(map(withTag));
  }

  deleteProject(projectId: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/projects/${projectId}`);
  }

  listProjectRevisions(projectId: number): Observable<ProjectRevisionList> {
    return this.http.get<ProjectRevisionList>(`/api/v1/projects/${projectId}/revisions`);
  }

  compareProjectRevisions(projectId: number, from: number, to: number): Observable<RevisionComparison> {
    return this.http.get<RevisionComparison>(`/api/v1/projects/${projectId}/revision-comparison`, {
      params: { from, to },
    });
  }

  recheckProject(projectId: number): Observable<ProjectRecheck> {
    return this.http.post<ProjectRecheck>(`/api/v1/projects/${projectId}/recheck`, null, problemShownByCaller());
  }
}
