import Link from 'next/link';
import type { ReactNode } from 'react';

/** A short safety note beside a brew-day step that can hurt someone, linking the safety guide. */
export function Caution({ children }: { children: ReactNode }) {
  return (
    <p className="mt-2 rounded-md border border-caution/40 bg-caution/5 p-2 font-sans text-xs text-ink">
      <span className="font-semibold text-caution">Caution: </span>
      {children} <Link href="/guides/safety">Safety guide</Link>
    </p>
  );
}

export const CAUTIONS = {
  hotLiquor:
    'Strike water and boiling wort scald. Lift and pour hot liquid with two hands and a clear path; keep children and pets away.',
  boil: 'A boil-over or a tipped kettle causes bad burns, and gas burners need fresh air: watch the kettle and brew outdoors or with ventilation.',
  chilling:
    'The kettle and the chiller’s outflow stay scalding while you chill: clamp hoses before turning the water on, keep the outflow away from feet and drains you stand over, and move the kettle only once it is cool.',
  lifting:
    'Wort is heavy (about 1 kg per litre): siphon or pump rather than lift a full vessel, lift with your legs and get help with anything above a comfortable carry.',
  glass:
    'Glass carboys break when knocked or wet and slippery; carry them in a crate or with a carrier, never by the neck.',
  chemicals:
    'Cleaning and sanitising chemicals burn skin and eyes: wear gloves and eye protection, and never mix chlorine cleaners with acids.',
  pressure:
    'Kegs, pressure fermenters and CO2 cylinders hold stored energy: use a regulator with a pressure relief valve, check seals, and release pressure before opening. CO2 displaces air, so vent enclosed spaces.',
  pressureLimits:
    'Kegs, pressure fermenters and spunding valves hold CO2 under pressure: never set a valve or regulator above the maker’s rated pressure for the vessel, keep a working relief valve fitted, release pressure before opening, and vent CO2 from enclosed spaces.',
  bottles:
    'Over-primed or under-fermented bottles can burst: measure the sugar, bottle only at a stable final gravity, and store bottles covered.',
} as const;
