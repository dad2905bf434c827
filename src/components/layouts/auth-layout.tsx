import { Outlet } from 'react-router';
import { Logo } from '@/components/brand/logo.js';
import { Cautions } from '@/components/ui/cautions.js';

/** Frame of the signed-out pages: a statement of purpose beside the form. */
export function AuthLayout() {
  return (
    <div className="flex min-h-screen flex-col lg:flex-row">
      <aside className="relative overflow-hidden bg-mulberry-900 px-8 py-8 text-paper lg:flex lg:w-[44%] lg:flex-col lg:justify-between lg:py-12">
        <GraticuleBackdrop />
        <div className="relative flex items-center gap-2">
          <Logo markOnly size={36} />
          <span className="text-xl font-semibold tracking-tight">Warpmeter</span>
        </div>
        <div className="relative mt-6 max-w-md lg:mt-0">
          <p className="text-2xl leading-snug font-semibold lg:text-3xl">
            Every flat map bends the Earth somewhere. Choose where.
          </p>
          <p className="mt-3 text-mulberry-100">
            Measure areal scale, angular deformation and distance error over the region you are mapping, compare candidate
            projections side by side, and keep a reproducible record of the one your client signed off.
          </p>
        </div>
        <p className="relative mt-6 hidden text-sm text-mulberry-100 lg:block">For cartography studios and their clients.</p>
      </aside>
      <div className="flex flex-1 flex-col">
        <main className="flex flex-1 items-start justify-center px-4 py-10 sm:items-center">
          <div className="w-full max-w-md">
            <Outlet />
          </div>
        </main>
        <footer className="border-t border-rule px-6 py-4">
          <Cautions compact />
        </footer>
      </div>
    </div>
  );
}

/**
 * Decorative: a conic graticule with a small indicatrix at each crossing, round on the middle
 * parallel and more stretched the farther a parallel lies from it. Outlines only, so the text
 * over it stays legible.
 */
function GraticuleBackdrop() {
  const apex = { x: 200, y: -260 };
  const parallels = [0, 1, 2, 3, 4, 5, 6, 7, 8];
  const meridians = [-4, -3, -2, -1, 0, 1, 2, 3, 4];
  const radius = (i: number) => 330 + i * 80;
  const angle = (m: number) => m * 0.17;
  return (
    <svg className="pointer-events-none absolute inset-0 h-full w-full" viewBox="0 0 400 600" preserveAspectRatio="xMidYMid slice" aria-hidden="true">
      <g fill="none" stroke="#f6f3ec" strokeOpacity=".12" strokeWidth="1">
        {parallels.map((i) => (
          <circle key={i} cx={apex.x} cy={apex.y} r={radius(i)} />
        ))}
        {meridians.map((m) => (
          <path key={m} d={`M${apex.x} ${apex.y} L${apex.x + Math.sin(angle(m)) * 1200} ${apex.y + Math.cos(angle(m)) * 1200}`} />
        ))}
      </g>
      <g fill="none" stroke="#e8b04a" strokeOpacity=".45" strokeWidth="1.2">
        {parallels.flatMap((i) =>
          meridians.map((m) => {
            const a = angle(m);
            const cx = apex.x + Math.sin(a) * radius(i);
            const cy = apex.y + Math.cos(a) * radius(i);
            const stretch = 1 + 0.045 * (i - 4) ** 2;
            return (
              <ellipse key={`${i}:${m}`} cx={cx} cy={cy} rx={7 * stretch} ry={7 / stretch} transform={`rotate(${(-a * 180) / Math.PI} ${cx} ${cy})`} />
            );
          }),
        )}
      </g>
    </svg>
  );
}
