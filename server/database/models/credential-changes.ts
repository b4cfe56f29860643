import { EventEmitter } from 'node:events';
import type { ModelOptions, Transaction } from 'sequelize';

/**
 * Announces committed changes to users, sessions and API tokens ('changed'), for whoever keeps
 * copies of them (the bearer-token cache). Writes of the last-used time alone are bookkeeping
 * and stay quiet; new rows need no announcement, since nothing can have copied them yet.
 */
export const credentialChanges = new EventEmitter();

const bookkeepingFields = new Set(['lastUsedAt', 'updatedAt']);

function announce(options: {
  transaction?: Transaction | null;
  fields?: ReadonlyArray<string | number | symbol>;
}): void {
  if (options.fields && options.fields.every((field) => bookkeepingFields.has(String(field)))) return;
  const emit = (): void => {
    credentialChanges.emit('changed');
  };
  if (options.transaction) options.transaction.afterCommit(emit);
  else emit();
}

/** The hooks a credential-bearing model declares in its `init` options. */
export const credentialChangeHooks: ModelOptions['hooks'] = {
  afterUpdate: (_instance, options) => announce(options),
  afterBulkUpdate: (options) => announce(options),
  afterDestroy: (_instance, options) => announce(options),
  afterBulkDestroy: (options) => announce(options),
};
