export { SigningSteps } from './signing-steps';
