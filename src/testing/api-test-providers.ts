// Test set-up: the app's real HTTP chain against Angular's HttpTestingController.
import { EnvironmentProviders, Provider } from '@angular/core';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { Routes, provideRouter } from '@angular/router';
import { provideApiHttp } from '../app/core/http/provide-api-http';

export function apiTestProviders(routes: Routes = []): (Provider | EnvironmentProviders)[] {
  return [provideApiHttp(), provideHttpClientTesting(), provideRouter(routes)];
}
