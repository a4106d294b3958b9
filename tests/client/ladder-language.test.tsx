import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { MemoryRouter } from 'react-router-dom';
import { boardResponse } from '../../shared/api/board.schema';
import { LadderTable } from '../../src/features/ladder/components/ladder.table';
import { i18n } from '../../src/i18n';
import { demoBoard } from './support/board-fixtures';
import { render, waitFor } from './support/render';

// Found walking the product: signing in after choosing French on the sign-in page left the Ladder's
// "Leading driver" and "Channel" cells in French while the rest of the screen turned English.
const rows = boardResponse.parse(demoBoard).rows;

afterEach(async () => {
  await act(async () => { await i18n.changeLanguage('en'); });
});

describe('the Ladder when the language changes', () => {
  it('when the language changes from French to English, then every cell follows, the worded ones too', async () => {
    await act(async () => { await i18n.changeLanguage('fr'); });
    const view = await render(<MemoryRouter><LadderTable rows={rows} caption="Ladder" /></MemoryRouter>);
    const c = view.container;
    await waitFor(() => expect(c.textContent).toContain('Signal des cas'));
    await act(async () => { await i18n.changeLanguage('en'); });
    await waitFor(() => expect(c.textContent).toContain('Case signal'));
    expect(c.textContent).not.toContain('Signal des cas');
    expect(c.textContent).not.toContain('Au-dessus du canal');
    view.unmount();
  });
});
