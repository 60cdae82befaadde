// The sign-out came from Wardbook itself (with an ID token hint), so no need to ask again.
document.querySelector('button[name="logout"][value="yes"]')?.click();
