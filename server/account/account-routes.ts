import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import type { Profile } from '../../contracts/account/account-answers';
import { DeleteAccountBody, PasswordChangeBody, ProfileBody } from '../../contracts/account/account-schemas';
import type { AuthService } from '../auth/auth-service';
import { requireSignedIn } from '../platform/require-role';
import { parse } from '../platform/validate';
import { zipStream } from './data-export-zip';
import { exportSummaryHtml } from './export-summary';
import type { PersonalDataService } from './personal-data-service';

/** How the download names itself and its times. */
export interface ExportSettings {
  siteName: string;
  timeZone: string;
}

/** The signed-in user's own profile, password, data download and account deletion under /api/account. */
export function accountRoutes(auth: AuthService, data: PersonalDataService, settings: ExportSettings): Router {
  const r = Router();
  r.use(requireSignedIn);

  r.get('/profile', async function profile(req, res) {
    const row = await auth.users.byId(req.user!.id);
    res.json({ user: req.user!, marketingOptOut: row?.marketing_opt_out ?? false } satisfies Profile);
  });

  r.patch('/profile', async function updateProfile(req, res) {
    const body = parse(ProfileBody, req.body);
    const user = await auth.updateProfile(req.user!.id, body);
    res.json({ user, marketingOptOut: body.marketingOptOut });
  });

  r.post('/password', async function changePassword(req, res) {
    const body = parse(PasswordChangeBody, req.body);
    await auth.changePassword(req.user!.id, body.currentPassword, body.newPassword, req.sessionID);
    res.status(204).end();
  });

  r.get('/export', async function exportData(req, res) {
    const held = await data.export(req.user!.id);
    const summary = exportSummaryHtml(held.sections, {
      siteName: settings.siteName,
      email: held.email,
      generatedAt: held.generatedAt,
      timeZone: settings.timeZone,
    });
    const files = [
      { name: 'summary.html', text: summary },
      ...held.sections.map((s) => ({ name: `${s.name}.json`, text: JSON.stringify(s.records, null, 2) + '\n' })),
    ];
    const day = held.generatedAt.toISOString().slice(0, 10);
    res.set({
      'Content-Type': 'application/zip',
      'Content-Disposition': `attachment; filename="padside-my-data-${day}.zip"`,
    });
    await pipeline(zipStream(files), res);
  });

  r.post('/delete', async function deleteAccount(req, res, next) {
    const { password } = parse(DeleteAccountBody, req.body);
    await data.deleteAccount(req.user!.id, password);
    // The deletion already removed every stored session; this one must not be saved again on the way out.
    req.logout({ keepSessionInfo: false }, (err) => {
      if (err) return next(err);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        res.clearCookie('padside.sid');
        res.json({ deleted: true });
      });
    });
  });

  return r;
}
