/**
 * Stand-in for Stripe.js, served by the browser test at the processor's script address (this machine cannot reach it):
 * a card frame with one field whose token is a test token the local payment fake accepts.
 */
export const STRIPE_JS_STAND_IN = `
window.Stripe = function (key) {
  window.__stripeKey = key;
  return {
    elements: function () {
      return {
        create: function () {
          var handlers = {};
          return {
            on: function (name, h) { handlers[name] = h; },
            mount: function (el) {
              var input = document.createElement('input');
              input.setAttribute('aria-label', 'Card number');
              input.addEventListener('input', function () {
                var digits = input.value.replace(/\\s/g, '');
                handlers.change && handlers.change({ complete: digits.length === 16, error: digits.length > 16 ? { message: 'Your card number is invalid.' } : undefined });
              });
              el.appendChild(input);
              setTimeout(function () { handlers.ready && handlers.ready(); });
            },
            destroy: function () {},
          };
        },
      };
    },
    createToken: function () { return Promise.resolve({ token: { id: 'tok_visa' } }); },
  };
};
window.Stripe.version = 'endive';
`;
