package org.specimenledger.web;

import jakarta.servlet.http.HttpServletResponse;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.SignedInUser;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.ControllerAdvice;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.ModelAttribute;

/**
 * What every page needs (the signed-in person and their navigation), and the two failures a page
 * shows as a page rather than as a problem document: a record that does not exist (404) and a page the
 * role may not open (403). Only for the HTML page controllers; the script endpoints answer with problems.
 */
@ControllerAdvice(assignableTypes = {StartPages.class, SpecimenPages.class, TestRunPages.class, EquipmentPage.class,
    CertificatePortal.class, CertificateDesk.class, TracePage.class, JobPages.class})
@Order(Ordered.HIGHEST_PRECEDENCE)
class PageAdvice {

    @ModelAttribute("me")
    SignedInUser me() {
        return CurrentUser.get().orElse(null);
    }

    @ModelAttribute("nav")
    Navigation nav() {
        return CurrentUser.get().map(u -> Navigation.of(u.role())).orElse(null);
    }

    @ExceptionHandler(RecordNotFound.class)
    String notFound(RecordNotFound e, Model model, HttpServletResponse response) {
        response.setStatus(404);
        model.addAttribute("me", me());
        model.addAttribute("nav", nav());
        model.addAttribute("title", "Not found");
        model.addAttribute("message", e.getMessage());
        return "problem";
    }

    @ExceptionHandler(AccessDeniedException.class)
    String denied(Model model, HttpServletResponse response) {
        response.setStatus(403);
        model.addAttribute("me", me());
        model.addAttribute("nav", nav());
        model.addAttribute("title", "Not for your role");
        model.addAttribute("message", "Your role may not open this page.");
        return "problem";
    }
}
