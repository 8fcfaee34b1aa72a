/** After the signature on the customer's page (issue 14): the deposit and the right to cancel. */
export { DepositStep } from './deposit-step';
export { CancelPanel } from './cancel-panel';
