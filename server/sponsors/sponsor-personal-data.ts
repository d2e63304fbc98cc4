import { plainRecord, type PersonalDataPart } from '../platform/personal-data';

/**
 * Being a sponsor's contact. On deletion the person stops being a contact (the sponsor, its agreements and its money
 * stay: they are the business's, not the person's). The build logs a person wrote are the build-logs feature's part.
 */
export const sponsorPersonalData: PersonalDataPart = {
  async export(trx, subject) {
    const contacts = await trx('sponsor_contacts as c')
      .join('sponsors as s', 's.id', 'c.sponsor_id')
      .where('c.user_id', subject.userId)
      .orderBy('s.name')
      .select('s.name as sponsor', 'c.created_at');
    return [
      {
        name: 'sponsor-contact',
        title: 'Sponsor contact',
        purpose: 'The sponsors whose portal you may open, as their contact.',
        records: contacts.map(plainRecord),
      },
    ];
  },

  async erase(trx, subject) {
    await trx('sponsor_contacts').where('user_id', subject.userId).delete();
  },
};
