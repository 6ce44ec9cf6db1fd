/**
 * English stop words: function words that say little about what a text is about.
 *
 * Source: common practice — a list of English pronouns, determiners, auxiliaries, prepositions,
 * conjunctions and frequent adverbs, written for this project. Contractions appear as our tokeniser
 * spells them: "n't" forms lose the apostrophe ("don't" → "dont"); other clitics are cut off before
 * the list is consulted ("we'll" → "we"). Negations are listed on purpose, as "not" is: they matter
 * to a sentence but rarely to its theme.
 */
const WORDS = `
a about above across after afterwards again against all almost alone along already also although always am among
amongst an and another any anyhow anyone anything anyway anywhere are arent around as at
be became because become becomes becoming been before beforehand behind being below beside besides between beyond
both but by
can cannot cant could couldnt
did didnt do does doesnt doing done dont down during
each either else elsewhere enough etc even ever every everyone everything everywhere except
few for former formerly from further furthermore
had hadnt has hasnt have havent having he hence her here hereafter hereby herein hers herself him himself his how
however
i ie if in indeed into is isnt it its itself
just
last latter latterly least less
many may maybe me meanwhile might mightnt mine more moreover most mostly much must mustnt my myself
namely neither never nevertheless next no nobody none noone nor not nothing now nowhere
of off often on once one only onto or other others otherwise ought our ours ourselves out over own
per perhaps please
quite
rather
same seem seemed seeming seems several shall shant she should shouldnt since so some somehow someone something
sometime sometimes somewhere still such
than that thats the their theirs them themselves then thence there thereafter thereby therefore therein thereupon
these they this those though through throughout thru thus to together too toward towards
under until up upon us
very via
was wasnt we were werent what whatever when whence whenever where whereafter whereas whereby wherein whereupon
wherever whether which while whither who whoever whole whom whose why will with within without wont would wouldnt
yet you your yours yourself yourselves
`;

/** The English stop-word list (lower case, apostrophes removed). */
export const ENGLISH_STOP_WORDS: ReadonlySet<string> = new Set(WORDS.split(/\s+/).filter((w) => w.length > 0));
