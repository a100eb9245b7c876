import type { Migration } from '../migrator';

// A run gets one decision, never a second: the database holds the rule too, not only the service's lock.
export const up: Migration = async ({ context: { queryInterface: q } }) => {
  await q.addIndex('reviews', ['upload_id'], { name: 'reviews_one_per_upload', unique: true });
};

export const down: Migration = async ({ context: { queryInterface: q } }) => {
  // The foreign key on upload_id now leans on this index: give it a plain one before dropping it.
  await q.addIndex('reviews', ['upload_id'], { name: 'reviews_upload_id' });
  await q.removeIndex('reviews', 'reviews_one_per_upload');
};
