import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { AuthApi } from './core/auth-api';
import { SessionService } from './core/session-service';
import { UserPreferences } from './core/user-preferences';
import { navigationLinks } from './navigation-links';

/** The application shell: the toolbar with the product name, the pages the signed-in role may use, and the account. */
@Component({
  selector: 'rf-root',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatButtonModule, MatIconModule],
  templateUrl: './app.html',
  styleUrl: './app.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  private readonly authApi = inject(AuthApi);
  private readonly router = inject(Router);
  protected readonly session = inject(SessionService);
  // made with the shell, so that a user's preferences load as soon as they sign in
  private readonly preferences = inject(UserPreferences);
  protected readonly links = computed(() => navigationLinks.filter((link) => this.session.hasRole(link.roles)));

  protected signOut(): void {
    const leave = () => {
      this.session.end();
      void this.router.navigateByUrl('/accounts/sign-in');
    };
    this.authApi.signOut().subscribe({ next: leave, error: leave });
  }
}
