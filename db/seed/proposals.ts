import { acceptProposal, addProposalComment, openProposal } from '@/lib/proposals/proposals';
import { getRecipe } from '@/lib/recipes/versions';
import type { SeedContext } from './context';

// Demo proposals: the kveik fork of the Millrace pale offers its hotter mash back (open, and the
// pale has moved on since, so the page shows the three-way picture), and the honey tripel's
// change was taken in by the tripel's owner (accepted, the proposer credited as co-author).

export async function seedProposals(ctx: SeedContext): Promise<void> {
  const member = (handle: string) => {
    const viewer = ctx.people.get(handle);
    if (!viewer) throw new Error(`no demo member ${handle}`);
    return viewer;
  };
  const recipeId = (key: string) => {
    const id = ctx.recipes.get(key);
    if (!id) throw new Error(`no demo recipe ${key}`);
    return id;
  };
  const headOf = async (key: string) => (await getRecipe(null, { id: recipeId(key) })).headVersionId!;

  const kveik = await openProposal(member('bastian'), {
    versionId: await headOf('millrace-kveik'),
    sourceRecipeId: recipeId('millrace-pale'),
    title: 'Kveik and a hotter mash for more body',
    description:
      'Fermented warm with kveik the pale finished thin, so I mashed at 68 °C. A hotter mash gave it the body it lacked, and it was ready in a week.\n\n- Kveik at 32 °C for 5 days\n- Mash at 68 °C',
  });
  await addProposalComment(
    member('wren'),
    kveik.id,
    'I like it. I mashed a degree cooler meanwhile, so the mash temperature needs a choice. Let me brew it first.',
  );
  await addProposalComment(member('bastian'), kveik.id, 'Fair. Pitch it warm, it really does want 30 °C or more.');

  const honey = await openProposal(member('rufus'), {
    versionId: await headOf('tripel-honey'),
    sourceRecipeId: recipeId('cloister-tripel'),
    title: 'Half the sugar as wildflower honey',
    description: 'Same dryness, a floral note in the finish.',
  });
  await acceptProposal(member('marisol'), honey.id, {
    sourceHeadVersionId: await headOf('cloister-tripel'),
    picks: {},
    message: 'Took in Rufus’s honey',
  });
}
