import type { Metadata } from 'next';

export const metadata: Metadata = { title: 'About' };

export default function AboutPage() {
  return (
    <article className="mx-auto max-w-2xl leading-relaxed">
      <h1 className="text-3xl font-semibold">About Kettlefork</h1>
      <p className="mt-4">
        Kettlefork is a community site for homebrewers. A recipe here is a record with a history: every time you save, a
        new version is kept with the numbers Kettlefork computes for it — original and final gravity, alcohol,
        bitterness, colour, water and carbonation.
      </p>
      <h2 className="mt-8 text-2xl font-semibold">Sharing and forking</h2>
      <p className="mt-2">
        Recipes can be public, unlisted (only people with the link can see them) or private. Anyone may fork a recipe
        they can see; the fork remembers the exact version it came from, so both brewers can compare their versions side
        by side.
      </p>
      <h2 className="mt-8 text-2xl font-semibold">Keeping it friendly</h2>
      <p className="mt-2">
        Moderators hide spam and abuse. If something looks wrong, report it and a moderator will look at it.
      </p>
      <h2 className="mt-8 text-2xl font-semibold">Brew safely</h2>
      <p className="mt-2">
        Brewing means boiling liquids, pressurised CO2, glass and cleaning chemicals. Kettlefork shows the usual
        cautions, but your equipment maker’s limits and your local codes come first. Please enjoy what you brew
        responsibly.
      </p>
    </article>
  );
}
