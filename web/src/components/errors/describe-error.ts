import { isRouteErrorResponse } from 'react-router';
import { isApiError } from '../../lib/api';

export type PlainError = {
  title: string;
  explanation: string;
  nextStep: string;
};

export function describeError(error: unknown): PlainError {
  if (isApiError(error)) {
    if (error.status === 0) {
      return {
        title: 'No connection to Shadowloop',
        explanation: error.message,
        nextStep: 'Try again in a moment. If it keeps failing, tell the site administrator.',
      };
    }
    if (error.status === 401) {
      return {
        title: 'You are signed out',
        explanation: 'Your session has ended.',
        nextStep: 'Sign in again with your plant account.',
      };
    }
    if (error.status === 403) {
      return {
        title: 'Not available for your role',
        explanation: error.message,
        nextStep: 'Ask an administrator if you need this.',
      };
    }
    if (error.status >= 500) {
      return {
        title: 'The Shadowloop server had a problem',
        explanation: error.message,
        nextStep: 'Try again in a moment. If it keeps failing, tell the site administrator.',
      };
    }
    return {
      title: 'The request was not accepted',
      explanation: error.message,
      nextStep: 'Check what you entered and try again.',
    };
  }
  if (isRouteErrorResponse(error)) {
    return {
      title: error.status === 404 ? 'Page not found' : `The page could not load (${error.status})`,
      explanation: typeof error.data === 'string' ? error.data : error.statusText,
      nextStep: 'Go back to the floor and try again from there.',
    };
  }
  return {
    title: 'Something went wrong on this page',
    explanation: 'The page stopped because of an unexpected error in the browser.',
    nextStep: 'Reload the page. If it happens again, tell the site administrator what you were doing.',
  };
}
