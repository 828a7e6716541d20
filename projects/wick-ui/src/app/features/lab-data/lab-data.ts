import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { LabRunSummary, LabSetSummary } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { apiProblem } from '../library/api-error';
import { LabDataApi } from './lab-data-api';
import { LAB_UNITS, celsius, orientationLabel, show } from './lab-format';

/** Lab data: measured runs and their replicate sets, newest first. */
@Component({
  selector: 'wick-lab-data',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatTableModule, MatTabsModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <header class="head">
        <h1>Lab data</h1>
        <span class="spacer"></span>
        <a mat-button routerLink="contact-angle"><mat-icon>water_drop</mat-icon> Contact angle</a>
        @if (canEdit()) {
          <a mat-flat-button routerLink="runs/new"><mat-icon>upload_file</mat-icon> Upload a run</a>
        }
      </header>
      <p class="intro">
        Measured wicking curves fitted with the Washburn slope and the gravity-restrained model; replicate runs form a set, whose
        fitted values can be proposed to the library.
      </p>
      @if (problem()) {
        <p class="wick-caution" role="alert">{{ problem() }}</p>
      }
      <mat-tab-group mat-stretch-tabs="false" animationDuration="0ms">
        <mat-tab [label]="'Runs (' + runs().length + ')'">
          @if (runs().length === 0 && !loading()) {
            <p class="empty">No lab runs yet.{{ canEdit() ? ' Upload a CSV of time and height (or mass) to start.' : '' }}</p>
          } @else {
            <table mat-table [dataSource]="runs()" class="table" aria-label="Lab runs">
              <ng-container matColumnDef="name">
                <th mat-header-cell *matHeaderCellDef>Run</th>
                <td mat-cell *matCellDef="let r"><a [routerLink]="['runs', r.id]">{{ r.name }}</a></td>
              </ng-container>
              <ng-container matColumnDef="set">
                <th mat-header-cell *matHeaderCellDef>Set</th>
                <td mat-cell *matCellDef="let r"><a [routerLink]="['sets', r.set.id]">{{ r.set.name }}</a></td>
              </ng-container>
              <ng-container matColumnDef="web">
                <th mat-header-cell *matHeaderCellDef>Web</th>
                <td mat-cell *matCellDef="let r">{{ r.web.name }} <small>rev. {{ r.web.revision }}</small></td>
              </ng-container>
              <ng-container matColumnDef="liquid">
                <th mat-header-cell *matHeaderCellDef>Liquid</th>
                <td mat-cell *matCellDef="let r">{{ r.liquidName }}, {{ celsius(r.temperature) }}</td>
              </ng-container>
              <ng-container matColumnDef="orientation">
                <th mat-header-cell *matHeaderCellDef>Orientation</th>
                <td mat-cell *matCellDef="let r">{{ orientationLabel(r.orientation) }}</td>
              </ng-container>
              <ng-container matColumnDef="slope">
                <th mat-header-cell *matHeaderCellDef>Washburn slope</th>
                <td mat-cell *matCellDef="let r">{{ show(r.figures.washburnSlope, units(r).slope) }}</td>
              </ng-container>
              <ng-container matColumnDef="equilibrium">
                <th mat-header-cell *matHeaderCellDef>Equilibrium</th>
                <td mat-cell *matCellDef="let r">{{ show(r.figures.equilibrium, units(r).value) }}</td>
              </ng-container>
              <ng-container matColumnDef="created">
                <th mat-header-cell *matHeaderCellDef>Uploaded</th>
                <td mat-cell *matCellDef="let r">{{ r.createdAt | date: 'mediumDate' }} · {{ r.createdBy.name }}</td>
              </ng-container>
              <tr mat-header-row *matHeaderRowDef="runColumns"></tr>
              <tr mat-row *matRowDef="let row; columns: runColumns"></tr>
            </table>
          }
        </mat-tab>
        <mat-tab [label]="'Replicate sets (' + sets().length + ')'">
          <table mat-table [dataSource]="sets()" class="table" aria-label="Replicate sets">
            <ng-container matColumnDef="name">
              <th mat-header-cell *matHeaderCellDef>Set</th>
              <td mat-cell *matCellDef="let s"><a [routerLink]="['sets', s.id]">{{ s.name }}</a></td>
            </ng-container>
            <ng-container matColumnDef="web">
              <th mat-header-cell *matHeaderCellDef>Web</th>
              <td mat-cell *matCellDef="let s">{{ s.webName }}</td>
            </ng-container>
            <ng-container matColumnDef="liquid">
              <th mat-header-cell *matHeaderCellDef>Liquid</th>
              <td mat-cell *matCellDef="let s">{{ s.liquidName }}</td>
            </ng-container>
            <ng-container matColumnDef="runs">
              <th mat-header-cell *matHeaderCellDef>Runs</th>
              <td mat-cell *matCellDef="let s">{{ s.runCount }} · {{ orientationLabel(s.orientation) }}, {{ s.measurement }}</td>
            </ng-container>
            <ng-container matColumnDef="proposals">
              <th mat-header-cell *matHeaderCellDef>Proposed to library</th>
              <td mat-cell *matCellDef="let s">
                @for (p of s.proposals; track p.revision) {
                  <span>revision {{ p.revision }}{{ p.submitted ? ' (submitted)' : ' (draft)' }}</span>
                } @empty {
                  —
                }
              </td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="setColumns"></tr>
            <tr mat-row *matRowDef="let row; columns: setColumns"></tr>
          </table>
        </mat-tab>
      </mat-tab-group>
    </section>
  `,
  styles: `
    .head { display: flex; align-items: center; gap: 8px; }
    .spacer { flex: 1; }
    h1 { font: var(--mat-sys-headline-small); }
    .intro, .empty { color: var(--mat-sys-on-surface-variant); }
    .table { width: 100%; }
    small { color: var(--mat-sys-on-surface-variant); }
  `,
})
export class LabData {
  private readonly api = inject(LabDataApi);
  private readonly auth = inject(AuthStore);
  protected readonly runs = signal<readonly LabRunSummary[]>([]);
  protected readonly sets = signal<readonly LabSetSummary[]>([]);
  protected readonly loading = signal(true);
  protected readonly problem = signal('');
  protected readonly canEdit = computed(() => this.auth.can('labdata:edit'));
  protected readonly runColumns = ['name', 'set', 'web', 'liquid', 'orientation', 'slope', 'equilibrium', 'created'];
  protected readonly setColumns = ['name', 'web', 'liquid', 'runs', 'proposals'];
  protected readonly show = show;
  protected readonly celsius = celsius;
  protected readonly orientationLabel = orientationLabel;

  constructor() {
    void this.load();
  }

  protected units(r: LabRunSummary) {
    return LAB_UNITS[r.measurement];
  }

  private async load(): Promise<void> {
    try {
      const [runs, sets] = await Promise.all([firstValueFrom(this.api.runs()), firstValueFrom(this.api.sets())]);
      this.runs.set(runs);
      this.sets.set(sets);
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    } finally {
      this.loading.set(false);
    }
  }
}
