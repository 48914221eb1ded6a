// Pure: shared by the server, the e-mail sender and client components.

export const NOTIFICATION_KINDS = [
  'fork',
  'comment',
  'reply',
  'star',
  'brewed',
  'new_recipe',
  'proposal',
  'proposal_decision',
] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

/** How each kind is named on the settings page and in unsubscribe messages. */
export const KIND_LABELS: Record<NotificationKind, string> = {
  fork: 'Someone forked your recipe',
  comment: 'Someone commented on your recipe',
  reply: 'Someone replied to your comment',
  star: 'Someone starred your recipe',
  brewed: 'Someone brewed your recipe',
  new_recipe: 'A member you follow published a new recipe',
  proposal: 'Someone proposed a change to your recipe',
  proposal_decision: 'The owner decided on your proposal',
};

/** The one line a notification reads as, in the site and in e-mails. */
export function describeNotification(kind: NotificationKind, actorName: string, recipeTitle: string): string {
  switch (kind) {
    case 'fork':
      return `${actorName} forked your recipe “${recipeTitle}”`;
    case 'comment':
      return `${actorName} commented on “${recipeTitle}”`;
    case 'reply':
      return `${actorName} replied to your comment on “${recipeTitle}”`;
    case 'star':
      return `${actorName} starred “${recipeTitle}”`;
    case 'brewed':
      return `${actorName} brewed “${recipeTitle}”`;
    case 'new_recipe':
      return `${actorName} published a new recipe: “${recipeTitle}”`;
    case 'proposal':
      return `${actorName} proposed a change to your recipe “${recipeTitle}”`;
    case 'proposal_decision':
      return `${actorName} decided on your proposal to “${recipeTitle}”`;
  }
}
