import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { firstValueFrom } from 'rxjs';
import type { MailboxMessage } from 'wick-core';
import { EmptyState } from '../../shared/empty-state/empty-state';
import { apiProblem } from '../library/api-error';
import { LibraryApi } from '../library/library-api';
import { when } from '../library/library-format';

/** What the app sent, as the local mail fake received it: for administrators checking notifications without a mail client. */
@Component({
  selector: 'wick-dev-mailbox',
  imports: [EmptyState, MatButtonModule, MatExpansionModule, MatIconModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <header>
        <h1>Development mailbox</h1>
        <div class="actions">
          <button mat-stroked-button type="button" (click)="load()" [disabled]="loading()"><mat-icon>refresh</mat-icon>Refresh</button>
          <button mat-button type="button" (click)="clear()" [disabled]="loading() || !messages().length"><mat-icon>delete_sweep</mat-icon>Empty</button>
        </div>
      </header>
      <p class="lead">Messages the app sent to the local mail fake (no real mail leaves this machine).</p>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading" />
      }
      @if (problem()) {
        <p class="problem" role="alert">{{ problem() }}</p>
      }
      @if (!available()) {
        <wick-empty-state icon="mail_off" heading="The mail fake is not running">npm start starts it beside the app.</wick-empty-state>
      } @else if (!messages().length) {
        <wick-empty-state icon="mail" heading="No messages">Submitting, approving or returning a library entry sends one.</wick-empty-state>
      } @else {
        <mat-accordion multi>
          @for (m of messages(); track m.id) {
            <mat-expansion-panel>
              <mat-expansion-panel-header>
                <mat-panel-title>{{ m.subject }}</mat-panel-title>
                <mat-panel-description>to {{ m.to.join(', ') }} · {{ when(m.receivedAt) }}</mat-panel-description>
              </mat-expansion-panel-header>
              <p class="from">From {{ m.from }}</p>
              <pre>{{ m.text }}</pre>
            </mat-expansion-panel>
          }
        </mat-accordion>
      }
    </section>
  `,
  styles: `
    header {
      display: flex;
      flex-wrap: wrap;
      justify-content: space-between;
      align-items: center;
      gap: 12px;
    }
    h1 {
      font: var(--mat-sys-headline-small);
    }
    .actions {
      display: flex;
      gap: 8px;
    }
    .lead,
    .from {
      color: var(--mat-sys-on-surface-variant);
    }
    pre {
      white-space: pre-wrap;
      font: var(--mat-sys-body-medium);
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
})
export class DevMailbox {
  private readonly api = inject(LibraryApi);
  protected readonly messages = signal<readonly MailboxMessage[]>([]);
  protected readonly available = signal(true);
  protected readonly loading = signal(false);
  protected readonly problem = signal('');
  protected readonly when = when;

  constructor() {
    void this.load();
  }

  protected async load(): Promise<void> {
    await this.run(async () => {
      const box = await firstValueFrom(this.api.mailbox());
      this.available.set(box.available);
      this.messages.set(box.messages);
    });
  }

  protected async clear(): Promise<void> {
    await this.run(async () => {
      const box = await firstValueFrom(this.api.clearMailbox());
      this.available.set(box.available);
      this.messages.set([]);
    });
  }

  private async run(work: () => Promise<void>): Promise<void> {
    this.loading.set(true);
    this.problem.set('');
    try {
      await work();
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    } finally {
      this.loading.set(false);
    }
  }
}
