import { plainRecord, type PersonalDataPart } from '../platform/personal-data';

/**
 * Being a sponsor's contact, and build logs written. On deletion the person stops being a contact (the sponsor, its
 * agreements and its money stay: they are the business's, not the person's); posts stay the team's, shown under the
 * deleted account's marker.
 */
export const sponsorPersonalData: PersonalDataPart = {
  async export(trx, subject) {
    // One after another: queries on one transaction share its connection.
    const [contacts, posts] = [
      await trx('sponsor_contacts as c')
        .join('sponsors as s', 's.id', 'c.sponsor_id')
        .where('c.user_id', subject.userId)
        .orderBy('s.name')
        .select('s.name as sponsor', 'c.created_at'),
      await trx('posts')
        .where('author_id', subject.userId)
        .orderBy('created_at')
        .select('slug', 'title', 'status', 'published_at', 'created_at'),
    ];
    return [
      {
        name: 'sponsor-contact',
        title: 'Sponsor contact',
        purpose: 'The sponsors whose portal you may open, as their contact.',
        records: contacts.map(plainRecord),
      },
      {
        name: 'build-logs-written',
        title: 'Build logs written',
        purpose: 'Build logs you wrote as an editor; they are the team’s and stay published.',
        records: posts.map(plainRecord),
      },
    ];
  },

  async erase(trx, subject) {
    await trx('sponsor_contacts').where('user_id', subject.userId).delete();
  },
};
