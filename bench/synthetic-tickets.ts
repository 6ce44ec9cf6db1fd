import { seededRandom } from '../server/common/random.js';

const TOPICS: Record<string, string[]> = {
  delivery: 'parcel courier tracking delayed arrived late dispatch driver depot address week'.split(' '),
  billing: 'invoice payment charged twice refund vat receipt card bank amount overdue'.split(' '),
  account: 'password login reset locked email verify account username sign code'.split(' '),
  product: 'size colour material stock dishwasher glaze weight dimensions handle lid'.split(' '),
  damage: 'broken cracked chipped smashed box packaging photo replacement damaged shards'.split(' '),
  booking: 'workshop session booking date evening voucher class seats cancel reschedule'.split(' '),
};
const FILLER = 'the a i my we you it is was and but to of for on with please thanks hello again still not have this that there when what'.split(' ');

/**
 * Seeded synthetic support tickets (~60 words, six topics) for benchmarks only: not used for any
 * quality claim.
 */
export function syntheticTickets(n: number, seed: number, words = 60): { text: string; label: string }[] {
  const random = seededRandom(seed);
  const labels = Object.keys(TOPICS);
  return Array.from({ length: n }, (_, i) => {
    const label = labels[i % labels.length];
    const own = TOPICS[label];
    const other = TOPICS[labels[Math.floor(random() * labels.length)]];
    const out: string[] = [];
    for (let w = 0; w < words; w++) {
      const r = random();
      out.push(r < 0.3 ? own[Math.floor(random() * own.length)] : r < 0.38 ? other[Math.floor(random() * other.length)] : FILLER[Math.floor(random() * FILLER.length)]);
    }
    return { text: out.join(' '), label };
  });
}
