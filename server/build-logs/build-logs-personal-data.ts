import { plainRecord, type PersonalDataPart } from '../platform/personal-data';

/** Build logs written. Posts stay the team's on deletion, shown under the deleted account's marker. */
export const buildLogsPersonalData: PersonalDataPart = {
  async export(trx, subject) {
    const posts = await trx('posts')
      .where('author_id', subject.userId)
      .orderBy('created_at')
      .select('slug', 'title', 'status', 'published_at', 'created_at');
    return [
      {
        name: 'build-logs-written',
        title: 'Build logs written',
        purpose: 'Build logs you wrote as an editor; they are the team’s and stay published.',
        records: posts.map(plainRecord),
      },
    ];
  },

  async erase() {
    // Nothing to erase: the posts are the team's, and the author's name goes with the account's own deletion.
  },
};
