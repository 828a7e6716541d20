import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import type { UploadCommitResult } from 'wick-core';
import { UploadPanel } from '../library/upload-panel';

/** Bulk import of webs from a CSV file: each row becomes a draft; a file with any bad row imports nothing. */
@Component({
  selector: 'wick-web-import',
  imports: [MatButtonModule, MatIconModule, RouterLink, UploadPanel],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <a class="back" routerLink="/materials/webs"><mat-icon>arrow_back</mat-icon>Webs</a>
      <h1>Import webs</h1>
      <wick-upload-panel purpose="web-import" (committed)="imported($event)" />
    </section>
  `,
  styles: `
    .back {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      text-decoration: none;
    }
    h1 {
      font: var(--mat-sys-headline-small);
    }
  `,
})
export class WebImport {
  private readonly router = inject(Router);
  protected imported(result: UploadCommitResult): void {
    if (result.entryIds.length) void this.router.navigate(['/materials/webs'], { queryParams: { imported: result.entryIds.length } });
  }
}
