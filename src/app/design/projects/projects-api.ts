import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Project, ProjectInput, ProjectList } from '../../../../shared/api/api-schemas';
import { problemShownByCaller } from '../../core/problem-details-interceptor';

/** The signed-in designer's saved projects, one method per operation. */
@Injectable({ providedIn: 'root' })
export class ProjectsApi {
  private readonly http = inject(HttpClient);

  listProjects(): Observable<ProjectList> {
    return this.http.get<ProjectList>('/api/v1/projects');
  }

  createProject(input: ProjectInput): Observable<Project> {
    return this.http.post<Project>('/api/v1/projects', input, problemShownByCaller());
  }

  getProject(projectId: number): Observable<Project> {
    return this.http.get<Project>(`/api/v1/projects/${projectId}`);
  }

  updateProject(projectId: number, input: ProjectInput): Observable<Project> {
    return this.http.put<Project>(`/api/v1/projects/${projectId}`, input, problemShownByCaller());
  }

  deleteProject(projectId: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/projects/${projectId}`);
  }
}
