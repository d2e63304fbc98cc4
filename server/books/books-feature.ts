import type { Feature, Platform } from '../feature';
import { BooksRepository } from './books-repository';
import { dashboardRoutes, feeSettingsRoutes, reportRoutes } from './books-routes';
import { BooksService } from './books-service';
import type { DashboardSources } from './dashboard-sources';

/** The treasurer's books: reports over every money movement, the dashboard, fee settings. */
export function booksFeature(
  platform: Platform,
  sources: () => Partial<DashboardSources>,
): Feature & { books: BooksService } {
  const { deps } = platform;
  const books = new BooksService(
    deps.db,
    new BooksRepository(deps.db, deps.config.clubTimeZone),
    platform.settings,
    deps.calendar,
    sources,
  );
  return {
    name: 'books',
    books,
    jobs: [{ name: 'books-actual-fees', cron: '*/15 * * * *', run: () => books.syncActualFees(deps.payments) }],
    mount(at) {
      at('/admin/reports', reportRoutes(books));
      at('/admin/dashboard', dashboardRoutes(books));
      at('/admin/settings/processor-fees', feeSettingsRoutes(books));
    },
  };
}
