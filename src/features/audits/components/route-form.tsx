import { useState, type FormEvent } from 'react';
import { routeQuerySchema } from '@shared/api/audits.schema.js';
import { Button } from '@/components/ui/button.js';
import { TextField } from '@/components/ui/form-field.js';

/** Two places as "longitude,latitude"; checked with the server's own schema before they are sent. */
export function RouteForm({ initialFrom, initialTo, onDraw }: { initialFrom: string; initialTo: string; onDraw: (from: string, to: string) => void }) {
  const [from, setFrom] = useState(initialFrom);
  const [to, setTo] = useState(initialTo);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = routeQuerySchema.safeParse({ from, to });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    onDraw(from.trim(), to.trim());
  };
  return (
    <form noValidate aria-label="Draw routes" onSubmit={submit} className="grid gap-4 sm:grid-cols-[1fr_1fr_auto] sm:items-start">
      <TextField label="From (longitude, latitude)" name="from" value={from} onChange={(e) => setFrom(e.target.value)} error={errors.from} placeholder="-70.65,-33.45" />
      <TextField label="To (longitude, latitude)" name="to" value={to} onChange={(e) => setTo(e.target.value)} error={errors.to} placeholder="-71.6,-53.2" />
      <Button type="submit" variant="secondary" className="sm:mt-[1.625rem]">
        Draw great circle and rhumb line
      </Button>
    </form>
  );
}
