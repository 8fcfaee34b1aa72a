export { SigningSteps } from './signing-steps';
export { useIsSigned } from './api';
