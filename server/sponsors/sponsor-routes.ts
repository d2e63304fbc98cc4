import { Router } from 'express';
import type {
  AdminSponsorRow,
  OverdueItem,
  PortalView,
  SponsorCreated,
  SponsorDetail,
  SponsorListing,
  SponsorSaved,
  SponsorWall,
  StaffAgreement,
} from '../../contracts/sponsors/sponsor-answers';
import type { Clock } from '../platform/clock';
import { requireRole } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import { acknowledgementCsv, acknowledgementPdf, type ReportData } from './acknowledgement-report';
import {
  DELIVERABLE_KIND_LABELS,
  DELIVERABLE_STATE_LABELS,
  deliverableState,
} from '../../contracts/labels/deliverable-kinds';
import { labelOf } from '../../contracts/labels/label-of';
import { inDateOrder, toCsv } from '../platform/csv';
import {
  AgreementBody,
  CashReceivedBody,
  ContactBody,
  HandCreditBody,
  SponsorBody,
  TiersSchema,
} from '../../contracts/sponsors/sponsor-schemas';
import type { AgreementService } from './agreement-service';
import type { SponsorService } from './sponsor-service';
import type { SponsorTierService } from './sponsor-tier-service';
import { deliverablesOnly, seesSponsorMoney, withoutEmail, withoutTotal } from './sponsor-staff-view';

/** The sponsors feature's services the staff and portal routes call. */
interface SponsorServices {
  sponsors: SponsorService;
  agreements: AgreementService;
  tiers: SponsorTierService;
}

/** Today's club date (the app's ClubCalendar), for routes that judge "overdue" and "this season". */
type Today = () => string;

/** GET /api/sponsors (public): every sponsor with its current tier, and the sponsors page grouped by tier. */
export function sponsorPublicRoutes(tiers: SponsorTierService, today: Today): Router {
  const r = Router();
  r.get('/', async function listSponsors(_req, res) {
    const items = await tiers.withTiers(today());
    res.json({ items: items.map((s) => ({ id: s.id, slug: s.slug, name: s.name, tier: s.tier })) } satisfies {
      items: SponsorListing[];
    });
  });
  r.get('/wall', async function sponsorWall(_req, res) {
    res.json((await tiers.publicWall(today())) satisfies SponsorWall);
  });
  return r;
}

const STAFF = ['editor', 'treasurer', 'admin'] as const;
const MONEY = ['treasurer', 'admin'] as const;

/**
 * /api/admin/sponsors: staff manage sponsors; agreements, cash, declared values, contacts and tiers are the treasurer's
 * and admin's (editors see the deliverables).
 */
export function sponsorAdminRoutes(
  { sponsors, agreements, tiers }: SponsorServices,
  clock: Clock,
  today: Today,
): Router {
  const r = Router();
  r.get('/', requireRole(...STAFF), async function listSponsorsAdmin(req, res) {
    const items = await tiers.withTiers(today());
    res.json({ items: seesSponsorMoney(req.user!.roles) ? items : items.map(withoutTotal) } satisfies {
      items: AdminSponsorRow[];
    });
  });
  r.post('/', requireRole(...STAFF), async function createSponsor(req, res) {
    const s = await sponsors.create(parse(SponsorBody, req.body));
    res.status(201).json({ id: s.id, slug: s.slug } satisfies SponsorCreated);
  });
  r.get('/tiers', requireRole(...STAFF), async function getTiers(_req, res) {
    res.json(await tiers.tiers());
  });
  r.put('/tiers', requireRole(...MONEY), async function putTiers(req, res) {
    res.json(await tiers.setTiers(parse(TiersSchema, req.body)));
  });
  r.get('/overdue', requireRole(...STAFF), async function overdueDeliverables(_req, res) {
    res.json({ items: await agreements.overdue(today()) } satisfies { items: OverdueItem[] });
  });
  r.post('/agreements/:agreementId/cash-received', requireRole(...MONEY), async function cashReceived(req, res) {
    const id = parse(fields.id, req.params.agreementId);
    res.status(201).json(await agreements.recordCashReceived(id, parse(CashReceivedBody, req.body), clock.now()));
  });
  r.get('/:id', requireRole(...STAFF), async function sponsorDetail(req, res) {
    const id = parse(fields.id, req.params.id);
    const sponsor = await sponsors.get(id);
    const [contacts, credits] = await Promise.all([sponsors.contacts(id), sponsors.creditsOf(id)]);
    res.json({
      sponsor,
      contacts: seesSponsorMoney(req.user!.roles) ? contacts : contacts.map(withoutEmail),
      credits,
    } satisfies SponsorDetail);
  });
  r.put('/:id', requireRole(...STAFF), async function updateSponsor(req, res) {
    res.json({
      sponsor: await sponsors.update(parse(fields.id, req.params.id), parse(SponsorBody, req.body)),
    } satisfies SponsorSaved);
  });
  r.post('/:id/agreements', requireRole(...MONEY), async function addAgreement(req, res) {
    res
      .status(201)
      .json(await agreements.addAgreement(parse(fields.id, req.params.id), parse(AgreementBody, req.body)));
  });
  r.get('/:id/ledger', requireRole(...STAFF), async function sponsorLedger(req, res) {
    const id = parse(fields.id, req.params.id);
    await sponsors.get(id);
    const ledger = await agreements.agreements(id, today());
    // Editors record and publish credits; cash, declared values and the deal's note are the treasurer's and admin's.
    res.json({
      agreements: seesSponsorMoney(req.user!.roles) ? ledger : ledger.map(deliverablesOnly),
    } satisfies { agreements: StaffAgreement[] });
  });
  r.get('/:id/ledger.csv', requireRole(...STAFF), async function sponsorLedgerCsv(req, res) {
    const id = parse(fields.id, req.params.id);
    const sponsor = await sponsors.get(id);
    const lines = (await agreements.agreements(id, today())).flatMap((a) =>
      a.deliverables.map((l) => ({ season: a.season, ...l })),
    );
    const rows = inDateOrder(lines, (l) => l.dueOn).map((l) => [
      l.season,
      labelOf(DELIVERABLE_KIND_LABELS, l.kind),
      l.promised,
      l.delivered,
      l.dueOn,
      DELIVERABLE_STATE_LABELS[deliverableState(l)],
    ]);
    res.set({
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="ledger-${sponsor.slug}-${today()}.csv"`,
    });
    res.send(toCsv(['Season', 'Deliverable', 'Promised', 'Delivered', 'Due on', 'State'], rows));
  });
  r.post('/:id/credits', requireRole(...STAFF), async function recordCredit(req, res) {
    const body = parse(HandCreditBody, req.body);
    const creditedAt = body.creditedOn ? new Date(`${body.creditedOn}T12:00:00Z`) : clock.now();
    res
      .status(201)
      .json(await sponsors.recordCredit(parse(fields.id, req.params.id), { ...body, creditedAt }, req.user!.id));
  });
  r.post('/:id/contacts', requireRole(...MONEY), async function addContact(req, res) {
    res.status(201).json(await sponsors.addContact(parse(fields.id, req.params.id), parse(ContactBody, req.body)));
  });
  r.delete('/:id/contacts/:userId', requireRole(...MONEY), async function removeContact(req, res) {
    await sponsors.removeContact(parse(fields.id, req.params.id), parse(fields.id, req.params.userId));
    res.status(204).end();
  });
  return r;
}

/** /api/sponsor-portal (role sponsor): the caller's own sponsor only; there is no sponsor id to choose. */
export function sponsorPortalRoutes(
  { sponsors, agreements: ledgers }: SponsorServices,
  today: Today,
  teamName: string,
  timeZone: string,
): Router {
  const r = Router();
  r.use(requireRole('sponsor'));
  const report = async (userId: number): Promise<ReportData> => {
    const sponsor = await sponsors.sponsorOfUser(userId);
    const [agreements, credits] = await Promise.all([
      ledgers.agreements(sponsor.id, today()),
      sponsors.creditsOf(sponsor.id),
    ]);
    return { sponsor, agreements, credits, generatedOn: today(), teamName, timeZone };
  };
  r.get('/me', async function portalMe(req, res) {
    const { sponsor, agreements, credits } = await report(req.user!.id);
    res.json({
      sponsor,
      agreements,
      credits: credits.map((c) => ({
        kind: c.kind,
        url: c.url,
        at: c.at,
        postSlug: c.postSlug ?? undefined,
        postTitle: c.postTitle ?? undefined,
        note: c.note,
        videoTimestamp: c.videoTimestamp,
      })),
    } satisfies PortalView);
  });
  r.get('/report.csv', async function portalReportCsv(req, res) {
    const data = await report(req.user!.id);
    res.set({
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="acknowledgement-${data.sponsor.slug}-${data.generatedOn}.csv"`,
    });
    res.send(acknowledgementCsv(data));
  });
  r.get('/report.pdf', async function portalReportPdf(req, res) {
    const data = await report(req.user!.id);
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="acknowledgement-${data.sponsor.slug}-${data.generatedOn}.pdf"`,
    });
    res.send(await acknowledgementPdf(data));
  });
  return r;
}
