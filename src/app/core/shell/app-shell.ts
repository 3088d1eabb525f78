import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenav, MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { ROLE_LABELS } from '@shared/roles';
import { AuthStore } from '../auth/auth-store';
import { DevMailProbe } from '../dev/dev-mail-probe';
import { TeamStore } from '../team/team-store';
import { NavLink, navLinksFor } from './nav-links';
import { TeamSwitcher } from './team-switcher';

/** Toolbar, side navigation by role (a drawer on phones) and the page outlet for signed-in users. */
@Component({
  selector: 'tw-app-shell',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatMenuModule,
    MatSidenavModule,
    MatToolbarModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    TeamSwitcher,
  ],
  templateUrl: './app-shell.html',
  styleUrl: './app-shell.scss',
})
export class AppShell {
  protected readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly devMail = inject(DevMailProbe);
  /** A player's links depend on what his team shares with players. */
  private readonly teams = inject(TeamStore);
  private readonly sidenav = viewChild(MatSidenav);
  protected readonly roleLabels = ROLE_LABELS;

  protected readonly isPhone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 839px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );

  protected readonly links = computed<NavLink[]>(() => {
    const links = navLinksFor(this.auth.role(), this.teams.sharing());
    return this.devMail.available() ? [...links, { path: '/dev/mailbox', label: 'Dev mailbox', icon: 'mail' }] : links;
  });

  /** A player has one page for now: no drawer, just the toolbar. */
  protected readonly hasNav = computed(() => this.links().length > 1);

  constructor() {
    void this.devMail.check();
  }

  protected closeOnPhone(): void {
    if (this.isPhone()) void this.sidenav()?.close();
  }

  protected signOut(): void {
    // Whatever the server answers, the user asked to leave: forget them locally too.
    const leave = () => {
      this.auth.clear();
      void this.router.navigate(['/sign-in'], { queryParams: { notice: 'signed-out' } });
    };
    this.auth.signOut().subscribe({ next: leave, error: leave });
  }
}
