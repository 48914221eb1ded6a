// The invented members of the demo club, the Millrace Homebrew Circle.
export const DEMO_PASSWORD = 'mash-paddle-demo';

export interface DemoPerson {
  handle: string;
  name: string;
  email: string;
  role: 'member' | 'moderator' | 'admin';
  units: 'metric' | 'us';
  bio: string;
}

export const demoPeople: DemoPerson[] = [
  {
    handle: 'ottoline',
    name: 'Ottoline Brask',
    email: 'ottoline@kettlefork.test',
    role: 'admin',
    units: 'metric',
    bio: 'Keeps the lights on. Brews lagers in a converted chest freezer.',
  },
  {
    handle: 'tamsin',
    name: 'Tamsin Achebe-Lund',
    email: 'tamsin@kettlefork.test',
    role: 'moderator',
    units: 'metric',
    bio: 'Stouts, porters and anything with oats.',
  },
  {
    handle: 'rufus',
    name: 'Rufus Quenneville',
    email: 'rufus@kettlefork.test',
    role: 'moderator',
    units: 'us',
    bio: 'Saisons in summer, barleywines in winter.',
  },
  {
    handle: 'wren',
    name: 'Wren Halloran',
    email: 'wren@kettlefork.test',
    role: 'member',
    units: 'metric',
    bio: 'Pale ales on a 20 litre kettle in a shed by the millrace.',
  },
  {
    handle: 'bastian',
    name: 'Bastian Okonkwo',
    email: 'bastian@kettlefork.test',
    role: 'member',
    units: 'us',
    bio: 'Kveik convert. My garage is warm and so is my fermenter.',
  },
  {
    handle: 'ilse',
    name: 'Ilse Marchetti',
    email: 'ilse@kettlefork.test',
    role: 'member',
    units: 'metric',
    bio: 'Wheat beers and the occasional sour.',
  },
  {
    handle: 'dov',
    name: 'Dov Pennywhistle',
    email: 'dov@kettlefork.test',
    role: 'member',
    units: 'us',
    bio: 'Learning water chemistry one salt at a time.',
  },
  {
    handle: 'marisol',
    name: 'Marisol Ferncastle',
    email: 'marisol@kettlefork.test',
    role: 'member',
    units: 'metric',
    bio: 'Belgian-style ales, brewed on a stovetop.',
  },
  {
    handle: 'kofi',
    name: 'Kofi Sandringham',
    email: 'kofi@kettlefork.test',
    role: 'member',
    units: 'metric',
    bio: 'IPAs. Too many hops is a myth.',
  },
  {
    handle: 'agnieszka',
    name: 'Agnieszka Thorne',
    email: 'agnieszka@kettlefork.test',
    role: 'member',
    units: 'metric',
    bio: 'Pilsners and patience.',
  },
  {
    handle: 'hollis',
    name: 'Hollis Varga',
    email: 'hollis@kettlefork.test',
    role: 'member',
    units: 'us',
    bio: 'Brown ales and bitters for the porch.',
  },
  {
    handle: 'juniper',
    name: 'Juniper Okafor-Reyes',
    email: 'juniper@kettlefork.test',
    role: 'member',
    units: 'metric',
    bio: 'New to all-grain; asking lots of questions.',
  },
  {
    handle: 'spamly',
    name: 'Best Deals Online',
    email: 'spamly@kettlefork.test',
    role: 'member',
    units: 'metric',
    bio: 'Cheap watches click here',
  },
];
