import { Parser } from 'htmlparser2';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, type BrowserSession } from '../helpers/browser';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, type Saved } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { ageAccount } from '../community/helpers';
import { proposalTo } from '../proposals/helpers';

/**
 * Known XSS payloads go through every place that renders user text: comments, recipe notes and
 * titles, bios, display names and report notes in the moderation queue. The served HTML must
 * carry no script of ours that a member wrote, no event handler and no script URL, and a real
 * browser loading the pages must never run the payloads' `kfXss()`.
 */
const PAYLOADS = [
  '<script>kfXss()</script>',
  '<img src=x onerror=kfXss()>',
  '<IMG SRC=JaVaScRiPt:kfXss()>',
  '<svg onload=kfXss()>',
  '<body onload=kfXss()>',
  '<iframe src="javascript:kfXss()"></iframe>',
  '<p style="width:expression(kfXss())">styled</p>',
  '<div style="background:url(javascript:kfXss())">bg</div>',
  '"><script>kfXss()</script>',
  "'><img src=x onerror=kfXss()>",
  '</script><script>kfXss()</script>',
  '<a href="&#106;avascript:kfXss()">entity link</a>',
  '<a href="vbscript:kfXss()">vb link</a>',
  '[click me](javascript:kfXss())',
  '[mixed case](JaVaScRiPt:kfXss())',
  '[entity](&#106;avascript:kfXss())',
  '[tabbed](java\tscript:kfXss())',
  '[data link](data:text/html;base64,PHNjcmlwdD5rZlhzcygpPC9zY3JpcHQ+)',
  '![tracker](javascript:kfXss())',
  '<javascript:kfXss()>',
  '%3Cscript%3EkfXss()%3C%2Fscript%3E',
  '&lt;script&gt;kfXss()&lt;/script&gt;',
];

const ALL = PAYLOADS.join('\n\n');

// Next.js's own inline scripts (the streamed page data, the bundler's chunk list and its bootstrapping) start like this.
const FRAMEWORK_INLINE = [
  /^\(?self\.__next_[a-z]/,
  /^\(globalThis\["TURBOPACK"\]/,
  /^\$R[A-Z]/,
  /^requestAnimationFrame\(/,
  /^document\.currentScript/,
];
const URL_ATTRIBUTES = new Set(['href', 'src', 'action', 'formaction', 'xlink:href', 'data', 'poster', 'background']);
const FORBIDDEN_TAGS = new Set(['iframe', 'object', 'embed', 'frame', 'frameset', 'applet', 'base', 'meta', 'link']);

/** Everything executable the served HTML carries besides the framework's own scripts. */
function executableParts(html: string): string[] {
  const found: string[] = [];
  const stack: { name: string; attribs: Record<string, string>; text: string }[] = [];
  const parser = new Parser(
    {
      onopentag(name, attribs) {
        stack.push({ name, attribs, text: '' });
        const inHead = stack.some((s) => s.name === 'head');
        if (FORBIDDEN_TAGS.has(name) && !(inHead && (name === 'meta' || name === 'link')))
          found.push(`<${name}> element`);
        for (const [attr, value] of Object.entries(attribs)) {
          const v = value.replace(/[\s\u0000-\u001f]/g, '').toLowerCase();
          if (attr.startsWith('on')) found.push(`${attr} handler on <${name}>`);
          if (URL_ATTRIBUTES.has(attr) && /^(javascript|vbscript|data):/.test(v))
            found.push(`${attr}="${value}" on <${name}>`);
          if (attr === 'style' && /expression\(|javascript:|url\(/.test(v)) found.push(`style="${value}" on <${name}>`);
        }
        if (name === 'script' && attribs.src && !attribs.src.startsWith('/_next/'))
          found.push(`script src=${attribs.src}`);
      },
      ontext(text) {
        if (stack.length) stack[stack.length - 1].text += text;
      },
      onclosetag(name) {
        const el = stack.pop();
        if (name === 'script' && el && !el.attribs.src) {
          const code = el.text.trim();
          if (code && !FRAMEWORK_INLINE.some((p) => p.test(code))) found.push(`inline script: ${code.slice(0, 80)}`);
        }
      },
    },
    { decodeEntities: true, lowerCaseTags: true, lowerCaseAttributeNames: true },
  );
  parser.write(html);
  parser.end();
  return found;
}

describe('user text cannot run script', () => {
  const pages: { name: string; client: TestClient; path: string }[] = [];
  let browser: BrowserSession;

  beforeAll(async () => {
    const { client: owner, user: ownerUser } = await signedInClient();
    const { client: commenter, user: commenterUser } = await signedInClient();
    const { client: reporter } = await signedInClient();
    const { client: follower } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');

    // Display name and bio of the commenter.
    const settings = (name: string) => ({
      name,
      bio: ALL,
      units: 'metric',
      defaultBatchVolumeL: 20,
      defaultEfficiencyPct: 72,
      emailChoices: {
        fork: true,
        comment: true,
        reply: true,
        star: true,
        brewed: true,
        new_recipe: true,
        proposal: true,
        proposal_decision: true,
      },
    });
    // An established member: a new one's link comments would wait for review instead of showing.
    await ageAccount(commenterUser.id);
    const named = await commenter.put(
      '/api/me/settings',
      settings('<img src=x onerror=kfXss()>"><script>kfXss()</script>'),
    );
    expect(named.status).toBe(200);
    // The name of a water report, shown in settings and the recipe editor.
    const watered = await commenter.put('/api/me/brewhouse', {
      boilOffLPerHour: null,
      trubLossL: null,
      grainAbsorptionLPerKg: null,
      mashWaterLPerKg: null,
      waterReport: {
        name: '<img src=x onerror=kfXss()>"><script>kfXss()</script>',
        calcium: 0,
        magnesium: 0,
        sodium: 0,
        chloride: 0,
        sulfate: 0,
        bicarbonate: 0,
      },
    });
    expect(watered.status).toBe(200);

    // Recipe notes and titles.
    const recipe = await createRecipeVia(owner, {
      document: paleAle({ title: '<script>kfXss()</script> Pale', notes: ALL }),
    });
    const titled: Saved[] = [];
    for (const p of PAYLOADS.filter((x) => x.length <= 100))
      titled.push(await createRecipeVia(commenter, { document: paleAle({ title: `${p} Ale` }) }));
    await follower.post('/api/follows', { type: 'member', id: commenterUser.id });

    // Comments (Markdown) and a reply.
    const comment = await commenter.post<{ comment: { id: string } }>(`/api/recipes/${recipe.recipe.id}/comments`, {
      body: ALL.slice(0, 5000),
    });
    expect(comment.status).toBe(201);
    await commenter.post(`/api/recipes/${recipe.recipe.id}/comments`, {
      body: '<svg onload=kfXss()>',
      parentId: comment.body.comment.id,
    });

    // Report notes, shown to moderators in the queue.
    const halves = [PAYLOADS.slice(0, 11).join('\n'), PAYLOADS.slice(11).join('\n')];
    expect(
      (
        await reporter.post('/api/reports', {
          targetType: 'comment',
          targetId: comment.body.comment.id,
          reason: 'abuse',
          note: halves[0],
        })
      ).status,
    ).toBe(201);
    expect(
      (
        await reporter.post('/api/reports', {
          targetType: 'member',
          targetId: commenterUser.id,
          reason: 'other',
          note: halves[1],
        })
      ).status,
    ).toBe(201);

    // A proposal's title, description and discussion.
    const proposal = await proposalTo(owner, {
      proposal: { title: '<script>kfXss()</script> idea', description: ALL.slice(0, 5000) },
    });
    expect(
      (await commenter.post(`/api/proposals/${proposal.id}/comments`, { body: '<img src=x onerror=kfXss()>' })).status,
    ).toBe(201);

    // A brew day of the payload-titled recipe: brew-day mode and the calibration chart show its title.
    const brewed = await owner.post<{ id: string }>('/api/brew-days', {
      versionId: recipe.version.id,
      brewedOn: '2026-02-01',
      og: { method: 'hydrometer', value: 1.05 },
    });
    expect(brewed.status).toBe(201);

    pages.push(
      { name: 'brew-day mode', client: owner, path: `/brew-days/${brewed.body.id}/live` },
      { name: 'my brew days with the calibration chart', client: owner, path: '/brew-days' },
      {
        name: 'proposal page with its title, description and discussion',
        client: new TestClient(),
        path: `/proposals/${proposal.id}`,
      },
      {
        name: 'recipe page with notes, comments and names',
        client: new TestClient(),
        path: `/recipes/${recipe.recipe.slug}`,
      },
      { name: 'recipe page seen by its owner', client: owner, path: `/recipes/${recipe.recipe.slug}` },
      { name: 'a payload title', client: new TestClient(), path: `/recipes/${titled[0].recipe.slug}` },
      { name: 'recent recipes', client: new TestClient(), path: '/recipes' },
      {
        name: 'member page with bio and display name',
        client: new TestClient(),
        path: `/members/${commenterUser.handle}`,
      },
      { name: 'notifications', client: owner, path: '/notifications' },
      { name: 'settings with a water report name', client: commenter, path: '/settings' },
      { name: 'feed', client: follower, path: '/feed' },
      { name: 'moderation queue with report notes', client: moderator, path: '/admin/moderation' },
      { name: 'owner’s member page', client: owner, path: `/members/${ownerUser.handle}` },
    );
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('serves HTML with no member-written script, event handler or script URL', async () => {
    for (const page of pages) {
      const res = await page.client.fetch(page.path);
      expect(res.status, page.name).toBe(200);
      const html = await res.text();
      expect(html, `${page.name} shows the payload text`).toMatch(/kfXss/);
      expect(executableParts(html), page.name).toEqual([]);
    }
  });

  it('never runs a payload in a real browser', async () => {
    browser = await openBrowser();
    await browser.page.addInitScript(() => {
      (window as unknown as { kfXss: () => void; __kfXssRuns: number }).__kfXssRuns = 0;
      (window as unknown as { kfXss: () => void }).kfXss = () => {
        (window as unknown as { __kfXssRuns: number }).__kfXssRuns += 1;
      };
    });
    for (const page of pages.filter((p) => p.client.cookieHeader() === '')) {
      await browser.page.goto(page.path, { waitUntil: 'load' });
      await browser.page.waitForTimeout(300);
      expect(
        await browser.page.evaluate(() => (window as unknown as { __kfXssRuns: number }).__kfXssRuns),
        page.name,
      ).toBe(0);
      const handlers = await browser.page.evaluate(() =>
        [...document.querySelectorAll('*')].flatMap((el) =>
          [...el.attributes]
            .filter((a) => a.name.startsWith('on') || /^\s*(javascript|data|vbscript):/i.test(a.value))
            .map((a) => `${el.tagName} ${a.name}`),
        ),
      );
      expect(handlers, page.name).toEqual([]);
    }
  });
});
