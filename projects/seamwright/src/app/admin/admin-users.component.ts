import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatIconModule } from '@angular/material/icon';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { debounceTime, distinctUntilChanged } from 'rxjs';
import { AdminUsersService } from '../resources/admin-users.service';
import { LoadState } from '../core/load-state';
import { NotifyService } from '../core/notify.service';
import { AuthService } from '../core/auth.service';
import type { Page, Role, User } from '../core/api-types';
import { DevInboxComponent } from './dev-inbox.component';

/** Admin: accounts, their roles, disabling; the development mail inbox. */
@Component({
  selector: 'sw-admin-users',
  imports: [
    DatePipe, ReactiveFormsModule, MatTableModule, MatPaginatorModule, MatSelectModule, MatSlideToggleModule, MatFormFieldModule,
    MatInputModule, MatIconModule, MatButtonModule, MatProgressBarModule, DevInboxComponent,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './admin-users.component.html',
  styles: `
    table { width: 100%; }
    .search { width: min(360px, 100%); }
    .role { width: 150px; }
    .you { margin-left: 6px; font-size: 0.8rem; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class AdminUsersComponent implements OnInit {
  private readonly admin = inject(AdminUsersService);
  private readonly notify = inject(NotifyService);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly auth = inject(AuthService);
  protected readonly state = new LoadState<Page<User>>();
  protected readonly rows = computed(() => this.state.value()?.items ?? []);
  protected readonly page = signal(1);
  protected readonly pageSize = signal(20);
  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly columns = ['displayName', 'email', 'role', 'disabled', 'createdAt'];

  ngOnInit(): void {
    this.reload();
    this.search.valueChanges.pipe(debounceTime(300), distinctUntilChanged(), takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      this.page.set(1);
      this.reload();
    });
  }

  protected onPage(e: PageEvent): void {
    this.page.set(e.pageIndex + 1);
    this.pageSize.set(e.pageSize);
    this.reload();
  }

  protected reload(): void {
    this.state.run(this.admin.list(this.search.value, this.page(), this.pageSize()));
  }

  protected setRole(u: User, role: Role): void {
    this.change(u, { role }, `${u.displayName} is now ${role === 'admin' ? 'an' : 'a'} ${role}`);
  }

  protected setDisabled(u: User, disabled: boolean): void {
    this.change(u, { disabled }, disabled ? `${u.displayName} can no longer sign in` : `${u.displayName} can sign in again`);
  }

  private change(u: User, change: { role?: Role; disabled?: boolean }, done: string): void {
    this.admin.update(u.id, change).subscribe({
      next: () => {
        this.notify.info(done);
        this.reload();
      },
      error: (err: unknown) => {
        this.notify.error(err);
        this.reload();
      },
    });
  }
}
