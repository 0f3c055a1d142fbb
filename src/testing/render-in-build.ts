// Test set-up: renders a build page with the app's HTTP chain, the router, the build preset in CurrentBuild and its id bound.
import { Binding, EnvironmentProviders, Provider, Type, inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { Routes } from '@angular/router';
import { render } from '@testing-library/angular/zoneless';
import type { BuildDto } from '../../shared/api/builds';
import type { BuildRole } from '../../shared/enums';
import { CurrentBuild } from '../app/features/builds/services/current-build';
import { apiTestProviders } from './api-test-providers';
import { testBuild } from './build-fixtures';

export interface RenderInBuildOptions {
  /** The caller's role on the build; the preset build is testBuild(role). */
  role: BuildRole;
  /** Changes to the preset build (a reviewer's ledger on a build at version 4, say). */
  build?: Partial<BuildDto>;
  /** Bound to the page's `buildId` input; 'b-1' is testBuild's id. */
  buildId?: string;
  providers?: (Provider | EnvironmentProviders)[];
  /** Bindings besides buildId. */
  bindings?: Binding[];
  routes?: Routes;
}

export async function renderInBuild<T>(component: Type<T>, options: RenderInBuildOptions) {
  const buildId = options.buildId ?? 'b-1';
  const result = await render(component, {
    providers: [
      ...apiTestProviders(options.routes),
      {
        // A page under the build shell reads the build the shell loaded: preset it, so the spec starts on the page's own calls.
        provide: CurrentBuild,
        useFactory: () => {
          const current = new CurrentBuild();
          current.set(testBuild(options.role, options.build));
          return current;
        },
      },
      ...(options.providers ?? []),
    ],
    bindings: [inputBinding('buildId', () => buildId), ...(options.bindings ?? [])],
  });
  return { ...result, http: TestBed.inject(HttpTestingController) };
}
