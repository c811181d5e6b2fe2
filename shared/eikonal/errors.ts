/** Bad solver input (velocity, grid size, source position). The message is meant for the person who made the model. */
export class EikonalInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EikonalInputError';
  }
}
