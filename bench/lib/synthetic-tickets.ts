import { seededRandom } from '../../server/common/random.js';

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

/**
 * Seeded documents over a Zipfian vocabulary of `vocabulary` invented words (rank r drawn with
 * weight 1/r), closer to real text's long tail than {@link syntheticTickets}; for benchmarks only.
 */
export function zipfianDocuments(n: number, seed: number, words = 60, vocabulary = 20_000): string[] {
  const random = seededRandom(seed);
  const syl = ['ka', 'lo', 'mi', 'ren', 'tu', 'sa', 'vo', 'del', 'pri', 'no', 'ga', 'zen', 'ur', 'bal', 'fi', 'te', 'ros', 'an'];
  const vocab = Array.from({ length: vocabulary }, (_, i) => {
    let w = '';
    for (let x = i + 1; x > 0; x = Math.floor(x / syl.length)) w += syl[x % syl.length];
    return w;
  });
  const cdf = new Float64Array(vocabulary);
  let acc = 0;
  for (let r = 0; r < vocabulary; r++) cdf[r] = acc += 1 / (r + 1);
  const pick = () => {
    const u = random() * acc;
    let lo = 0;
    let hi = vocabulary - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cdf[mid] < u) lo = mid + 1;
      else hi = mid;
    }
    return vocab[lo];
  };
  return Array.from({ length: n }, () => Array.from({ length: words }, pick).join(' '));
}
