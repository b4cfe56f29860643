import { Injectable } from '@angular/core';

const storageKey = 'riffle.project-etags.v1';

/**
 * The ETag of each project as this tab last opened or saved it, kept for the tab's session like
 * the draft, so a save after a reload still says which revision it was made on.
 */
@Injectable({ providedIn: 'root' })
export class ProjectTags {
  private readonly tags = new Map<number, string>(this.restored());

  of(projectId: number): string | null {
    return this.tags.get(projectId) ?? null;
  }

  remember(projectId: number, etag: string | null): void {
    if (etag) this.tags.set(projectId, etag);
    else this.tags.delete(projectId);
    try {
      sessionStorage.setItem(storageKey, JSON.stringify([...this.tags]));
    } catch {
      // A full or disabled storage only costs the reload memory: the next save goes without If-Match.
    }
  }

  private restored(): Array<[number, string]> {
    try {
      return JSON.parse(sessionStorage.getItem(storageKey) ?? '[]') as Array<[number, string]>;
    } catch {
      return [];
    }
  }
}
