import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { PackFoodForm } from '@/components/foods/pack-food-form';
import { ApiError } from '@/components/api/client';

const shareOptions = [{ profileId: null, label: 'Only me' }];

describe('PackFoodForm', () => {
  it('sends per-serving values as numbers with the label convention, reading a decimal comma', async () => {
    const onSubmit = jest.fn();
    render(<PackFoodForm onSubmit={onSubmit} shareOptions={shareOptions} />);

    fireEvent.change(screen.getByLabelText('Food name'), { target: { value: 'Oat crackers' } });
    fireEvent.click(screen.getByRole('radio', { name: 'Per serving' }));
    fireEvent.change(await screen.findByLabelText('Serving weight'), { target: { value: '30' } });
    fireEvent.click(screen.getByRole('radio', { name: 'US “Total carbohydrate”' }));
    fireEvent.change(screen.getByLabelText('Total carbohydrate'), { target: { value: '24' } });
    fireEvent.change(screen.getByLabelText('Fibre'), { target: { value: '4,5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save pack food' }));

    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit.mock.calls[0][0]).toMatchObject({
      name: 'Oat crackers', basis: 'perServing', servingGrams: 30, convention: 'us', carbohydrate: 24, fibre: 4.5, protein: null, sharedProfileId: null,
    });
  });

  it.each([
    { name: 'a serving of 0 g', serving: '0', carb: '10', message: 'Serving size must be more than 0 g.' },
    { name: 'a carbohydrate that is not a number', serving: '30', carb: 'ten', message: 'Carbohydrate must be a number.' },
    { name: 'a negative carbohydrate', serving: '30', carb: '-2', message: 'Carbohydrate cannot be negative.' },
  ])('shows the shared schema message for $name and does not submit', async ({ serving, carb, message }) => {
    const onSubmit = jest.fn();
    render(<PackFoodForm onSubmit={onSubmit} shareOptions={shareOptions} />);

    fireEvent.change(screen.getByLabelText('Food name'), { target: { value: 'Crackers' } });
    fireEvent.click(screen.getByRole('radio', { name: 'Per serving' }));
    fireEvent.change(await screen.findByLabelText('Serving weight'), { target: { value: serving } });
    fireEvent.change(screen.getByLabelText('Carbohydrate'), { target: { value: carb } });
    fireEvent.click(screen.getByRole('button', { name: 'Save pack food' }));

    expect(await screen.findByText(message)).toBeInTheDocument();
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('places a server field error on its field', async () => {
    render(
      <PackFoodForm
        onSubmit={jest.fn()}
        shareOptions={shareOptions}
        submitError={new ApiError(400, 'validation_failed', 'Some fields are invalid.', { name: ['Give the food a name.'] })}
      />,
    );

    expect(await screen.findByText('Give the food a name.')).toBeInTheDocument();
  });
});
