import { describe, expect, it } from 'vitest';
import { act } from 'react';
import { adminMe, demoDistricts, fakeApi, json } from './support/fake-api';
import { click, getButton, waitFor, type Rendered, renderRoutes } from './support/render';

let view: Rendered | undefined;

/** Put a file in a file input, as a person choosing it would. */
async function chooseFile(input: HTMLInputElement, name: string, text: string) {
  const file = new File([text], name, { type: 'application/geo+json' });
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  await act(async () => {
    input.dispatchEvent(new Event('change', { bubbles: true }));
  });
}

describe('boundary upload form', () => {
  it('when the server questions a boundary as swapped, then the reason shows in words and "Save this boundary anyway" sends it again with confirm', async () => {
    const square = { type: 'Polygon', coordinates: [[[20, 12], [21, 12], [21, 13], [20, 13], [20, 12]]] };
    let puts = 0;
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      [`PUT /api/districts/${demoDistricts[0].id}/boundary`]: () => {
        if (++puts === 1)
          return json(409, {
            error: {
              code: 'boundary_coordinates_swapped', message: 'English text the client does not parse',
              params: { distanceKm: 1540, swappedDistanceKm: 12, nearest: 'HV-01', swappedNearest: 'HV-02', confirmable: true },
            },
          });
        return json(200, demoDistricts[0]);
      },
    });
    view = await renderRoutes('/admin/districts');
    const edit = await waitFor(() => {
      const b = view!.container.querySelector<HTMLButtonElement>('button[aria-label="Edit HV-01 Saltmarsh Coast"]');
      if (!b) throw new Error('no Edit button for HV-01 yet');
      return b;
    }, 5000);
    await click(edit);
    const form = await waitFor(() => {
      const f = view!.container.querySelector<HTMLFormElement>(`form[aria-labelledby="boundary-${demoDistricts[0].id}"]`);
      if (!f) throw new Error('no boundary form yet');
      return f;
    }, 5000);
    await chooseFile(form.querySelector<HTMLInputElement>('input[type="file"]')!, 'hv01.geojson', JSON.stringify(square));
    await click(getButton(form, 'Upload the boundary'));
    await waitFor(() => expect(form.textContent).toContain('with longitude and latitude swapped it would lie 12 km from HV-02'), 3000);
    await click(getButton(form, 'Save this boundary anyway'));
    await waitFor(() => expect(form.textContent).toContain('Boundary saved from hv01.geojson.'), 3000);
    const urls = fetchMock.mock.calls.filter((c) => (c[1] as RequestInit | undefined)?.method === 'PUT').map((c) => String(c[0]));
    expect(urls).toHaveLength(2);
    expect(urls[0]).not.toContain('confirm=true');
    expect(urls[1]).toContain('confirm=true');
  });
});
