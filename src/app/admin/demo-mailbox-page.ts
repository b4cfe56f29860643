import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import type { DemoMailMessage } from '../../../shared/api/api-schemas';
import { AdminApi } from './admin-api';

/** A piece of a message's text: plain words, or a link to follow. */
interface TextPart {
  text: string;
  link: boolean;
}

function splitLinks(text: string): TextPart[] {
  return text
    .split(/(https?:\/\/\S+)/)
    .filter((part) => part !== '')
    .map((part) => ({ text: part, link: /^https?:\/\//.test(part) }));
}

/** What the built-in demo mail server received, so invitations and resets can be followed without a mailbox. */
@Component({
  selector: 'rf-demo-mailbox-page',
  imports: [DatePipe, MatExpansionModule, MatButtonModule, MatIconModule],
  templateUrl: './demo-mailbox-page.html',
  styleUrl: './demo-mailbox-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DemoMailboxPage {
  private readonly adminApi = inject(AdminApi);
  protected readonly messages = signal<Array<DemoMailMessage & { parts: TextPart[] }>>([]);
  protected readonly unavailable = signal(false);

  constructor() {
    this.reload();
  }

  /** Bytes as a reader takes them in: B, KiB or MiB. */
  protected sizeText(bytes: number): string {
    if (bytes < 1024) return `${bytes} B`;
    if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
    return `${(bytes / 1024 / 1024).toFixed(1)} MiB`;
  }

  protected reload(): void {
    this.adminApi.listDemoMail().subscribe({
      next: ({ messages }) =>
        this.messages.set(messages.map((message) => ({ ...message, parts: splitLinks(message.text) }))),
      error: () => this.unavailable.set(true),
    });
  }
}
