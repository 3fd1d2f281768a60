import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { SiteSettingsService } from './site-settings-service';

describe('SiteSettingsService', () => {
  afterEach(() => jest.useRealTimers());

  it("returns the site's today, and moves on to the next day at the site's midnight on a screen left open", async () => {
    jest.useFakeTimers({ now: new Date('2027-03-10T05:59:30Z') }); // 23:59:30 on 9 March in Chicago (CST, UTC−6)
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const service = TestBed.inject(SiteSettingsService);
    TestBed.inject(HttpTestingController)
      .expectOne('/api/settings')
      .flush({ settings: { siteName: 'Example', timezone: 'America/Chicago', snugMarginMinutes: 3 } });
    await service.load();
    expect(service.today()).toBe('2027-03-09');
    jest.advanceTimersByTime(60_000);
    expect(service.today()).toBe('2027-03-10');
  });
});
