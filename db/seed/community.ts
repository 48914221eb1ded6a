import { addComment } from '@/lib/community/comments';
import { setFollow } from '@/lib/community/follows';
import { setStar } from '@/lib/community/stars';
import { createReport } from '@/lib/moderation/reports';
import type { SeedContext } from './context';

/** Demo comments, stars and follows among the Millrace Homebrew Circle, and spam for the moderators' queue. */
export async function seedCommunity(ctx: SeedContext): Promise<void> {
  const member = (handle: string) => {
    const v = ctx.people.get(handle);
    if (!v) throw new Error(`no demo member ${handle}`);
    return v;
  };
  const recipe = (key: string) => {
    const id = ctx.recipes.get(key);
    if (!id) throw new Error(`no demo recipe ${key}`);
    return id;
  };

  const stars: [string, string][] = [
    ['bastian', 'millrace-pale'],
    ['ilse', 'millrace-pale'],
    ['kofi', 'millrace-pale'],
    ['juniper', 'millrace-pale'],
    ['wren', 'lantern-stout'],
    ['dov', 'lantern-stout'],
    ['agnieszka', 'weir-pils'],
    ['hollis', 'farmhouse-saison'],
    ['marisol', 'garage-kveik'],
    ['wren', 'orchard-ipa'],
  ];
  for (const [handle, key] of stars) await setStar(member(handle), recipe(key), true);

  const follows: [string, string][] = [
    ['juniper', 'wren'],
    ['juniper', 'tamsin'],
    ['bastian', 'wren'],
    ['dov', 'kofi'],
    ['ilse', 'marisol'],
  ];
  for (const [who, whom] of follows) await setFollow(member(who), { type: 'member', id: member(whom).id }, true);
  await setFollow(member('kofi'), { type: 'recipe', id: recipe('millrace-pale') }, true);

  const pale = recipe('millrace-pale');
  const question = await addComment(member('juniper'), pale, {
    body: 'First all-grain batch here. Did you **mash out**, or go straight to the sparge?',
    versionNumber: 1,
  });
  await addComment(member('wren'), pale, {
    parentId: question.comment.id,
    body: 'Straight to the sparge: at this volume the mash-out step made no difference I could taste.',
  });
  await addComment(member('bastian'), pale, {
    body: 'Brewed it with kveik at 35 °C. Done in four days and still clean.',
  });
  await addComment(member('dov'), recipe('lantern-stout'), {
    body: 'What water profile do you aim for? I ended up with a mash pH of 5.1.',
  });
  await addComment(member('tamsin'), recipe('lantern-stout'), {
    body: 'A little chalk in the mash brings it up; aim for 5.4.',
  });

  // Spam for the moderators: a reported recipe, a reported comment and a comment held for review.
  const spamly = member('spamly');
  const spam = recipe('spam');
  await createReport(member('wren'), {
    targetType: 'recipe',
    targetId: spam,
    reason: 'spam',
    note: 'Advertising watches, not a recipe.',
  });
  await createReport(member('bastian'), { targetType: 'recipe', targetId: spam, reason: 'spam', note: '' });
  const pitch = await addComment(spamly, pale, {
    body: 'Great recipe!!! Brewers save big on luxury watches, message me',
  });
  await createReport(member('ilse'), {
    targetType: 'comment',
    targetId: pitch.comment.id,
    reason: 'spam',
    note: 'Same account as the watch recipe.',
  });
  await addComment(spamly, recipe('lantern-stout'), {
    body: 'Best prices here: [cheap watches](https://deals.example/watches)',
  });
  await createReport(member('hollis'), {
    targetType: 'member',
    targetId: spamly.id,
    reason: 'spam',
    note: 'Every post is an advert.',
  });
}
