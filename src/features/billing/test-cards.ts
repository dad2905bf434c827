import { TEST_PAYMENT_METHODS } from '@shared/api/billing.schema.js';
import type { SelectOption } from '@/components/ui/select.js';

/**
 * The cards the local payment provider knows. A hosted card form would hand over its own
 * payment-method id instead; the server accepts either.
 */
export const TEST_CARD_OPTIONS: readonly SelectOption[] = TEST_PAYMENT_METHODS.map((m) => ({ value: m.id, label: m.label }));
