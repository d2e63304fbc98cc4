import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { UserRepository } from '../server/auth/user-repository';
import { parseContentFile } from '../server/build-logs/content-import';
import { PostRepository } from '../server/build-logs/post-repository';
import { PostService } from '../server/build-logs/post-service';
import { loadConfig, projectRoot } from '../server/config';
import { SettingsService } from '../server/settings/settings-service';
import { AgreementRepository } from '../server/sponsors/agreement-repository';
import { AgreementService } from '../server/sponsors/agreement-service';
import { CreditRepository } from '../server/sponsors/credit-repository';
import { CreditService } from '../server/sponsors/credit-service';
import { SponsorRepository } from '../server/sponsors/sponsor-repository';
import { SponsorService } from '../server/sponsors/sponsor-service';
import { SponsorTaxService } from '../server/sponsors/sponsor-tax-service';
import { SponsorTierService } from '../server/sponsors/sponsor-tier-service';
import { postTitles } from '../server/build-logs/build-logs-feature';
import { ShopConfigRepository } from '../server/shop/shop-config-repository';

/** The invented sponsors of Thrust & Filament, with their 2026 agreements. */
export const SPONSORS = [
  {
    name: 'Voltwhistle Electronics',
    website: 'https://voltwhistle.example',
    blurb: 'The electronics counter on Main Street in Gopher Flats: switches, wire and advice.',
    contact: 'sponsor@padside.test',
    // Promotion bought: taxed at the team's GST rate for Manitoba (the treasurer chose this treatment).
    agreement: {
      season: '2026',
      taxTreatment: 'promotion' as const,
      taxProvince: 'MB' as const,
      cashCents: 40_000,
      inKind: [{ description: 'Screw switches and terminal blocks', valueCents: 6_500, receivedOn: '2026-05-02' }],
      deliverables: [
        { kind: 'build_log_credit' as const, quantity: 3, dueOn: '2026-10-31' },
        { kind: 'video_mention' as const, quantity: 1, dueOn: '2027-03-31' },
        { kind: 'sponsors_page' as const, quantity: 1, dueOn: '2026-06-30' },
      ],
    },
  },
  {
    name: 'Spoolgoblin Filament Co.',
    website: 'https://spoolgoblin.example',
    blurb: 'Filament spun in Manitoba; they sent the PETG our fin cans are printed in.',
    agreement: {
      season: '2026',
      cashCents: 0,
      inKind: [{ description: 'Nine spools of PETG filament', valueCents: 27_000, receivedOn: '2026-04-20' }],
      deliverables: [
        { kind: 'build_log_credit' as const, quantity: 2, dueOn: '2026-09-30' },
        { kind: 'logo_on_merch' as const, quantity: 1, dueOn: '2027-01-31' },
      ],
    },
  },
  {
    name: 'Glumbrella Canopy Works',
    website: 'https://glumbrella.example',
    blurb: 'Hand-sewn recovery canopies for model rockets.',
    agreement: {
      season: '2026',
      cashCents: 150_000,
      inKind: [{ description: 'Two 90 cm canopies', valueCents: 18_000, receivedOn: '2026-07-15' }],
      deliverables: [
        { kind: 'build_log_credit' as const, quantity: 2, dueOn: '2026-12-31' },
        { kind: 'social_post' as const, quantity: 2, dueOn: '2026-11-15' },
      ],
    },
  },
  {
    name: 'Inkwobble Screenworks',
    website: 'https://inkwobble-screenworks.example',
    blurb: 'The shirt printers behind every Thrust & Filament limited run.',
    agreement: {
      season: '2026',
      cashCents: 10_000,
      inKind: [],
      deliverables: [{ kind: 'build_log_credit' as const, quantity: 1, dueOn: '2026-12-15' }],
    },
  },
];

export async function seed(knex: Knex): Promise<void> {
  const config = loadConfig();
  const users = new UserRepository(knex);
  const sponsorRepo = new SponsorRepository(knex);
  const agreementRepo = new AgreementRepository(knex);
  const creditRepo = new CreditRepository(knex);
  const credits = new CreditService(creditRepo, sponsorRepo, agreementRepo, config.publicUrl, config.site.teamName);
  const settings = new SettingsService(knex);
  const sponsorTax = new SponsorTaxService(
    knex,
    sponsorRepo,
    agreementRepo,
    settings,
    new ShopConfigRepository(knex),
    config.site.teamName,
  );
  const titles = postTitles(knex);
  const sponsors = new SponsorService(knex, sponsorRepo, creditRepo, credits, users, titles);
  const tiers = new SponsorTierService(sponsorRepo, agreementRepo, settings, titles);
  const agreements = new AgreementService(knex, sponsorRepo, agreementRepo, sponsorTax, tiers);
  const posts = new PostService(knex, new PostRepository(knex), sponsorRepo, credits);

  for (const s of SPONSORS) {
    if ((await sponsorRepo.all()).some((row) => row.name === s.name)) continue;
    const created = await sponsors.create({ name: s.name, website: s.website, blurb: s.blurb });
    await agreements.addAgreement(created.id, s.agreement);
    if (s.contact) await sponsors.addContact(created.id, { email: s.contact });
  }

  const dir = path.join(projectRoot, 'content');
  for (const file of readdirSync(dir)
    .filter((f) => f.endsWith('.md'))
    .sort()) {
    const post = parseContentFile(file, readFileSync(path.join(dir, file), 'utf8'));
    if (await knex('posts').where('slug', post.slug).first()) continue;
    const author = await users.byEmail(post.author);
    const credited = await sponsorRepo.bySlugs(post.credits);
    await posts.create(
      {
        title: post.title,
        slug: post.slug,
        summary: post.summary,
        markdown: post.markdown,
        tags: post.tags,
        membersOnly: post.membersOnly,
        status: 'published',
        credits: credited.map((c) => Number(c.id)),
      },
      author ? Number(author.id) : null,
      post.publishedAt,
    );
  }
}
