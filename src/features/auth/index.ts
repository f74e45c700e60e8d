/** Accounts: the signed-in user's query, sign-out, and the sign-in, sign-up and password-reset forms. */
export { authKeys, meQueryOptions, useSignOut } from './api';
export { AuthCard } from './components/auth-card';
export { NewPasswordForm } from './components/new-password-form';
export { ResetRequestForm } from './components/reset-request-form';
export { SignInForm } from './components/sign-in-form';
export { SignUpForm } from './components/sign-up-form';
