/**
 * A request that passes its field checks but not the physics, with the request field to blame
 * (a dotted path such as "loads" or "cases.1.loads"), so the API can answer 400 on that field.
 * @example throw new EngineInputError('loads', 'The loads put no weight on the front wheel.')
 */
export class EngineInputError extends RangeError {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'EngineInputError';
  }
}
