import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import { catchError, of } from 'rxjs';
import type { BuiltInLiquidRow } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { EntryTable } from '../library/entry-table';
import { LibraryApi } from '../library/library-api';
import { formatValue } from '../library/library-format';

/** Test liquids: the built-in models (read-only) and the company's own liquids with revisions and review. */
@Component({
  selector: 'wick-liquids',
  imports: [EntryTable, MatButtonModule, MatIconModule, MatTableModule, MatTooltipModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <header>
        <h1>Test liquids</h1>
        @if (auth.can('library:edit')) {
          <a mat-flat-button routerLink="/liquids/new"><mat-icon>add</mat-icon>New liquid</a>
        }
      </header>

      <h2>Built in (read-only, at 20 °C)</h2>
      <p class="lead">Water from the IAPWS and CIPM formulas, saline and handbook solvents, as the physics library computes them.</p>
      <div class="table-wrap">
        <table mat-table [dataSource]="builtIns()" class="built-in">
          <ng-container matColumnDef="name">
            <th mat-header-cell *matHeaderCellDef>Liquid</th>
            <td mat-cell *matCellDef="let l">
              {{ l.name }}
              @if (l.flammable) {
                <mat-icon class="flame" matTooltip="Flammable" aria-label="Flammable">local_fire_department</mat-icon>
              }
            </td>
          </ng-container>
          <ng-container matColumnDef="surfaceTension">
            <th mat-header-cell *matHeaderCellDef>Surface tension</th>
            <td mat-cell *matCellDef="let l" [matTooltip]="l.sources.surfaceTension">{{ fmt(l.surfaceTension, 'mN/m') }}</td>
          </ng-container>
          <ng-container matColumnDef="viscosity">
            <th mat-header-cell *matHeaderCellDef>Viscosity</th>
            <td mat-cell *matCellDef="let l" [matTooltip]="l.sources.viscosity">{{ fmt(l.viscosity, 'mPa s') }}</td>
          </ng-container>
          <ng-container matColumnDef="density">
            <th mat-header-cell *matHeaderCellDef>Density</th>
            <td mat-cell *matCellDef="let l" [matTooltip]="l.sources.density">{{ fmt(l.density, 'kg/m^3') }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="builtInColumns"></tr>
          <tr mat-row *matRowDef="let l; columns: builtInColumns"></tr>
        </table>
      </div>
      @if (anyFlammable()) {
        <p class="wick-caution"><mat-icon aria-hidden="true">warning</mat-icon>
          Flammable reference solvents: use small quantities in a fume hood away from ignition sources, follow the safety data
          sheet and local regulations, and have the procedure reviewed. Values are engineering estimates — confirm with standard tests.
        </p>
      }

      <h2>Company liquids</h2>
      <wick-entry-table kind="liquid" />
    </section>
  `,
  styles: `
    header {
      display: flex;
      align-items: center;
      justify-content: space-between;
      gap: 12px;
    }
    h1 {
      font: var(--mat-sys-headline-small);
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin-top: 24px;
    }
    .lead {
      color: var(--mat-sys-on-surface-variant);
    }
    .table-wrap {
      overflow-x: auto;
    }
    .built-in {
      width: 100%;
    }
    .flame {
      font-size: 18px;
      width: 18px;
      height: 18px;
      vertical-align: middle;
      color: var(--mat-sys-tertiary);
    }
    .wick-caution {
      margin-top: 12px;
    }
  `,
})
export class Liquids {
  protected readonly auth = inject(AuthStore);
  protected readonly builtIns = toSignal(inject(LibraryApi).builtInLiquids().pipe(catchError(() => of([] as BuiltInLiquidRow[]))), {
    initialValue: [] as BuiltInLiquidRow[],
  });
  protected readonly builtInColumns = ['name', 'surfaceTension', 'viscosity', 'density'];
  protected anyFlammable(): boolean {
    return this.builtIns().some((l) => l.flammable);
  }
  protected fmt(si: number, unit: string): string {
    return formatValue(si, unit);
  }
}
