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

/** A loose conic-like graticule with a few indicatrices, purely decorative. */
function GraticuleBackdrop() {
  const parallels = [0, 1, 2, 3, 4, 5, 6, 7];
  const meridians = [-4, -3, -2, -1, 0, 1, 2, 3, 4];
  return (
    <svg
      className="pointer-events-none absolute inset-0 h-full w-full"
      viewBox="0 0 400 600"
      preserveAspectRatio="xMidYMid slice"
      aria-hidden="true"
    >
      <g fill="none" stroke="#f6f3ec" strokeOpacity=".12" strokeWidth="1">
        {parallels.map((i) => (
          <circle key={i} cx="200" cy="-260" r={360 + i * 70} />
        ))}
        {meridians.map((m) => (
          <path key={m} d={`M200 -260 L${200 + Math.sin(m * 0.16) * 1000} ${-260 + Math.cos(m * 0.16) * 1000}`} />
        ))}
      </g>
      <g fill="#e8b04a" fillOpacity=".22">
        {[
          [120, 210, 26, 16, -20],
          [280, 300, 34, 12, 25],
          [170, 420, 42, 10, -8],
          [330, 500, 30, 18, 40],
        ].map(([cx, cy, rx, ry, rot]) => (
          <ellipse key={`${cx}-${cy}`} cx={cx} cy={cy} rx={rx} ry={ry} transform={`rotate(${rot} ${cx} ${cy})`} />
        ))}
      </g>
    </svg>
  );
}
