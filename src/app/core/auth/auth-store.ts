import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, firstValueFrom, tap } from 'rxjs';
import type { LoginRequest, Membership, MeResponse } from '@shared/api/auth';
import type { Role } from '@shared/roles';
import { inlineErrors } from '../http/inline-errors';

const SELECTED_TEAM_KEY = 'trenchwork.selectedTeamId';

/**
 * Who is signed in, in which teams, and which team they are looking at.
 * The session itself is an httpOnly cookie; this store only mirrors GET /api/auth/me.
 */
@Injectable({ providedIn: 'root' })
export class AuthStore {
  private readonly http = inject(HttpClient);
  private readonly session = signal<MeResponse | null>(null);
  private readonly chosenTeamId = signal<number | null>(readStoredTeamId());
  private probe: Promise<boolean> | null = null;

  readonly user = computed(() => this.session()?.user ?? null);
  readonly memberships = computed<Membership[]>(() => this.session()?.memberships ?? []);
  readonly isSignedIn = computed(() => this.user() !== null);

  /** The chosen team when the user still belongs to it, else their first team. */
  readonly membership = computed<Membership | null>(() => {
    const list = this.memberships();
    return list.find((m) => m.teamId === this.chosenTeamId()) ?? list[0] ?? null;
  });
  readonly teamId = computed(() => this.membership()?.teamId ?? null);
  readonly role = computed<Role | null>(() => this.membership()?.role ?? null);

  /**
   * Asks the server once who is signed in. Also makes the first GET of the page,
   * which gives the browser its XSRF-TOKEN cookie before any POST.
   */
  ensureLoaded(): Promise<boolean> {
    this.probe ??= this.refresh();
    return this.probe;
  }

  async refresh(): Promise<boolean> {
    try {
      const me = await firstValueFrom(this.http.get<MeResponse>('/api/auth/me', { context: inlineErrors() }));
      this.session.set(me);
      return true;
    } catch (failure) {
      // 401 means "not signed in"; an unreachable server is treated the same so public pages still work.
      if (failure instanceof HttpErrorResponse) {
        this.session.set(null);
        return false;
      }
      throw failure;
    }
  }

  signIn(credentials: LoginRequest): Observable<MeResponse> {
    return this.http
      .post<MeResponse>('/api/auth/login', credentials, { context: inlineErrors() })
      .pipe(tap((me) => this.setSession(me)));
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/logout', {}).pipe(tap(() => this.clear()));
  }

  setSession(me: MeResponse): void {
    this.session.set(me);
    this.probe = Promise.resolve(true);
  }

  /** Forgets the user locally (after sign-out or when the server says the session is gone). */
  clear(): void {
    this.session.set(null);
    this.probe = Promise.resolve(false);
  }

  selectTeam(teamId: number): void {
    this.chosenTeamId.set(teamId);
    try {
      localStorage.setItem(SELECTED_TEAM_KEY, String(teamId));
    } catch {
      // Private browsing can refuse storage; the choice then lasts for this tab only.
    }
  }
}

function readStoredTeamId(): number | null {
  try {
    const stored = Number(localStorage.getItem(SELECTED_TEAM_KEY));
    return Number.isInteger(stored) && stored > 0 ? stored : null;
  } catch {
    return null;
  }
}
