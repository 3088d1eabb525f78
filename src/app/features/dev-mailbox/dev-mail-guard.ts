import { inject } from '@angular/core';
import { CanMatchFn } from '@angular/router';
import { DevMailProbe } from '../../core/dev/dev-mail-probe';

/** The mailbox exists only while the API answers /api/dev/mail; otherwise the URL is simply not found. */
export const devMailGuard: CanMatchFn = () => inject(DevMailProbe).check();
