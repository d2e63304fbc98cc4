import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RESPONSE_INIT } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { ProductPage } from './product-page';
import type { ProductDetail } from '@contracts/shop/shop-answers';

const PRODUCT: ProductDetail = {
  id: 7,
  slug: 'coulee-tee',
  name: 'Coulee Tee',
  priceCents: 3200,
  currency: 'CAD',
  weightGrams: 210,
  maxPerOrder: 5,
  images: [],
  sizeChart: null,
  orderable: true,
  run: null,
  variants: [{ id: 70, sku: 'CT-1', label: 'One size', priceCents: 3200, weightGrams: 210, remaining: 12 }],
  descriptionHtml: '<p>Heavy cotton.</p>',
};

/** Lets the answer land and the page render. */
const settle = async () => {
  await new Promise((resolve) => setTimeout(resolve, 0));
  TestBed.tick();
};

describe('ProductPage when the product does not load', () => {
  // Stands in for the server render's response (RESPONSE_INIT), whose status the page sets.
  let response: ResponseInit;
  beforeEach(() => {
    response = {};
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: RESPONSE_INIT, useValue: response },
      ],
    });
  });

  async function open(): Promise<{ element: HTMLElement; http: HttpTestingController }> {
    const fixture = TestBed.createComponent(ProductPage);
    fixture.componentRef.setInput('slug', 'coulee-tee');
    TestBed.tick();
    return { element: fixture.nativeElement as HTMLElement, http: TestBed.inject(HttpTestingController) };
  }

  it('should say the item is not found, answer 404 and offer no retry when the API answers 404', async () => {
    const { element, http } = await open();
    http
      .expectOne('/api/products/coulee-tee')
      .flush({ error: { code: 'not_found', message: 'No such product.' } }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('Item not found');
    expect(response.status).toBe(404);
    expect(Array.from(element.querySelectorAll('button')).map((b) => b.textContent!.trim())).not.toContain('Try again');
  });

  it('should say it could not load, answer 503, and show the product after "Try again" when the API fails', async () => {
    const { element, http } = await open();
    http
      .expectOne('/api/products/coulee-tee')
      .flush(
        { error: { code: 'internal', message: 'Something went wrong.' } },
        { status: 500, statusText: 'Internal Server Error' },
      );
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('This item could not be loaded');
    expect(element.textContent).not.toContain('Item not found');
    expect(response.status).toBe(503);

    const retry = Array.from(element.querySelectorAll('button')).find((b) => b.textContent!.trim() === 'Try again')!;
    retry.click();
    TestBed.tick();
    http.expectOne('/api/products/coulee-tee').flush(PRODUCT);
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('Coulee Tee');
    // One retry, one request: nothing else asked for the product.
    expect(http.match('/api/products/coulee-tee')).toEqual([]);
  });

  it('should treat a lost connection like a failure, not like a missing item', async () => {
    const { element, http } = await open();
    http
      .expectOne('/api/products/coulee-tee')
      .error(new ProgressEvent('error'), { status: 0, statusText: 'Unknown Error' });
    await settle();
    expect(element.querySelector('h1')!.textContent).toBe('This item could not be loaded');
    expect(response.status).toBe(503);
  });
});
